// Starting on a port another program holds fails with the port named, instead of reporting an address it does
// not listen on (Express 5's app.listen hands the listen error to its callback as well as emitting it).
// source: Node.js documentation, net "server.listen()": a port in use emits 'error' with code EADDRINUSE;
// Express 5 API reference, app.listen (the callback is also called with an error).
import net from 'node:net'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { loadConfig } from '../../server/config.js'
import { startServer } from '../../server/main.js'

let holder: net.Server
let port = 0

beforeAll(async () => {
  holder = net.createServer()
  await new Promise<void>((resolve) => holder.listen(0, '127.0.0.1', () => resolve()))
  port = (holder.address() as net.AddressInfo).port
})
afterAll(() => {
  holder?.close()
})

describe('starting the server', () => {
  it('refuses to start on a port that is taken, naming it', async () => {
    const config = { ...loadConfig(process.env), port, host: '127.0.0.1' }
    await expect(startServer(config)).rejects.toThrow(`Port ${port} on 127.0.0.1 is already in use`)
  })

  it('starts on a free port and answers there', async () => {
    const running = await startServer({ ...loadConfig(process.env), port: 0, host: '127.0.0.1' })
    try {
      expect(running.url).not.toMatch(/:0$/)
      const res = await fetch(`${running.url}/api/health`)
      expect(res.status).toBe(200)
    } finally {
      await running.close()
    }
  })
})
