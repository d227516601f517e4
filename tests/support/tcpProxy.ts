// A TCP pass-through in front of PostgreSQL that a test can cut and restore: from the server's side, exactly what a
// database that stops (every connection dropped, new ones refused) and comes back looks like.
import { createServer, connect, type Server, type Socket } from 'node:net'
import { freePort } from './instance'

export interface TcpProxy {
  port: number
  cut: () => Promise<void>
  restore: () => Promise<void>
  close: () => Promise<void>
}

export async function startTcpProxy(target: { host: string; port: number }): Promise<TcpProxy> {
  const port = await freePort()
  const sockets = new Set<Socket>()
  let server: Server | undefined
  const listen = () =>
    new Promise<void>((resolve, reject) => {
      server = createServer(client => {
        const upstream = connect(target.port, target.host)
        for (const s of [client, upstream]) {
          sockets.add(s)
          s.on('close', () => sockets.delete(s))
          s.on('error', () => s.destroy())
        }
        client.pipe(upstream).pipe(client)
        client.on('close', () => upstream.destroy())
        upstream.on('close', () => client.destroy())
      })
      server.once('error', reject).listen(port, '127.0.0.1', () => resolve())
    })
  const cut = async () => {
    const closed = new Promise<void>(resolve => (server ? server.close(() => resolve()) : resolve()))
    for (const s of sockets) s.destroy()
    await closed
    server = undefined
  }
  await listen()
  return { port, cut, restore: listen, close: cut }
}
