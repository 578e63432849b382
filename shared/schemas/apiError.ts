// The one error shape every API error answers with. The client words `code` (and each field's code)
// in the user's language with `params`; `message` is English, for logs and people reading the API.
import type { ErrorParams, Problem } from '../errors/errorCodes.js'

export interface ApiErrorBody {
  error: {
    code: string
    message: string
    params?: ErrorParams
    fields?: Record<string, Problem>
  }
}
