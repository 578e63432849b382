// The security headers every answer carries, as helmet sets them for the options below. helmet runs once at
// start, on a real node:http response (a request on an unconnected socket), and the headers it left on that
// response are then set on each answer in one step, rather than through helmet's dozen middleware per request.
// A real response takes whatever way helmet sets a header (setHeader, appendHeader, removeHeader…); should a
// helmet release finish later than at once, or set nothing, the app refuses to start instead of answering
// without them. tests/api/securityHeaders.test.ts compares the API's headers with helmet's own on a live
// Express answer for the same options, so an upgrade that changes them fails there.
import { IncomingMessage, ServerResponse, type OutgoingHttpHeader } from 'node:http'
import { Socket } from 'node:net'
import type { RequestHandler } from 'express'
import helmet, { type HelmetOptions } from 'helmet'

export const helmetOptions: Readonly<HelmetOptions> = {
  contentSecurityPolicy: {
    useDefaults: false,
    directives: {
      defaultSrc: ["'self'"],
      scriptSrc: ["'self'"],
      styleSrc: ["'self'", "'unsafe-inline'"], // component libraries set inline styles
      imgSrc: ["'self'", 'data:', 'blob:'],
      fontSrc: ["'self'", 'data:'],
      connectSrc: ["'self'"],
      mediaSrc: ["'self'", 'data:', 'blob:'],
      workerSrc: ["'self'", 'blob:'],
      objectSrc: ["'none'"],
      baseUri: ["'self'"],
      formAction: ["'self'"],
      frameAncestors: ["'none'"],
    },
  },
  strictTransportSecurity: false, // set by the TLS-terminating proxy in production
}

/** The headers helmet sets on a real response for these options (names in lower case, as Node keeps them). */
export function helmetHeaders(options: Readonly<HelmetOptions> = helmetOptions): [string, OutgoingHttpHeader][] {
  const socket = new Socket()
  const req = new IncomingMessage(socket)
  req.method = 'GET'
  req.url = '/'
  const res = new ServerResponse(req)
  let finished = false
  let failure: unknown
  try {
    helmet(options)(req, res, (err?: unknown) => {
      finished = true
      failure = err
    })
  } finally {
    socket.destroy()
  }
  if (failure) throw failure instanceof Error ? failure : new Error(String(failure))
  if (!finished) throw new Error('helmet did not finish at once: its headers can no longer be worked out at start')
  const headers = res.getHeaderNames().map((name): [string, OutgoingHttpHeader] => [name, res.getHeader(name)!])
  if (!headers.length) throw new Error('helmet set no header on a real response')
  return headers
}

/** Sets helmet's headers (worked out once, they hold no nonce and do not depend on the request) on each answer. */
export function securityHeaders(options: Readonly<HelmetOptions> = helmetOptions): RequestHandler {
  const headers = helmetHeaders(options)
  return (_req, res, next) => {
    for (const [name, value] of headers) res.setHeader(name, value)
    next()
  }
}
