/** One line of a stock confirmation: what it is, what it was, what it becomes. */
export interface ChangeLine {
  label: string
  before?: string | number
  after: string | number
}
