// A stand-in for the browser's Worker in unit tests: an API object exposed through comlink on a MessageChannel,
// so the page side's `wrap()` talks to it exactly as to a real worker (structured clone included).
import { expose, type Endpoint } from 'comlink'

export class ChannelWorker {
  channel = new MessageChannel()
  constructor(api: object) {
    expose(api, this.channel.port2 as unknown as Endpoint)
    this.channel.port1.start()
  }
  postMessage(m: unknown, transfer?: Transferable[]) {
    this.channel.port1.postMessage(m, transfer ?? [])
  }
  addEventListener(type: string, f: (e: MessageEvent) => void) {
    if (type === 'message') this.channel.port1.addEventListener('message', f)
  }
  removeEventListener(type: string, f: (e: MessageEvent) => void) {
    if (type === 'message') this.channel.port1.removeEventListener('message', f)
  }
  terminate() {
    this.channel.port1.close()
    this.channel.port2.close()
  }
}
