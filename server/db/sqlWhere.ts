// Builds a WHERE clause from optional filters: each condition with its own placeholders, in order.
export class SqlWhere {
  private readonly parts: string[] = []
  readonly params: unknown[] = []

  /** Adds the condition when `when` holds (default: always). */
  add(condition: string, params: unknown[] = [], when = true): this {
    if (when) {
      this.parts.push(condition)
      this.params.push(...params)
    }
    return this
  }

  /** "WHERE a AND b", or '' when there are no conditions; `prefix` joins onto an existing WHERE. */
  sql(prefix: 'WHERE' | 'AND' = 'WHERE'): string {
    return this.parts.length ? `${prefix} ${this.parts.join(' AND ')}` : ''
  }
}
