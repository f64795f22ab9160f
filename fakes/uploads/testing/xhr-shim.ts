// Node has no XMLHttpRequest; the SDK's browser client PUTs with one. This shim does the same
// request over fetch so tests drive the real `genUploader` unchanged. Progress is reported once,
// at the end (fetch exposes no upload progress).

type Listener = (event: { loaded: number }) => void;

class ListenerSet {
  private map = new Map<string, Listener[]>();
  addEventListener(type: string, fn: Listener): void {
    this.map.set(type, [...(this.map.get(type) ?? []), fn]);
  }
  emit(type: string, event: { loaded: number }): void {
    for (const fn of this.map.get(type) ?? []) fn(event);
  }
}

export class FetchXhr extends ListenerSet {
  status = 0;
  statusText = '';
  response: unknown = null;
  responseType = '';
  readonly upload = new ListenerSet();
  private method = 'GET';
  private url = '';
  private headers = new Headers();
  private controller = new AbortController();

  open(method: string, url: string): void {
    this.method = method;
    this.url = url;
  }

  setRequestHeader(name: string, value: string): void {
    this.headers.set(name, value);
  }

  send(body?: FormData | Blob | string | null): void {
    const size = body instanceof FormData ? [...body.values()].reduce((n, v) => n + (typeof v === 'string' ? v.length : v.size), 0) : 0;
    fetch(this.url, { method: this.method, headers: this.headers, body: body ?? null, signal: this.controller.signal })
      .then(async (res) => {
        this.status = res.status;
        this.statusText = res.statusText;
        const text = await res.text();
        if (this.responseType === 'json') {
          try {
            this.response = JSON.parse(text);
          } catch {
            this.response = null;
          }
        } else this.response = text;
        this.upload.emit('progress', { loaded: size });
        this.emit('load', { loaded: size });
      })
      .catch(() => this.emit('error', { loaded: 0 }));
  }

  abort(): void {
    this.controller.abort();
  }
}

/** Installs the shim as the global XMLHttpRequest; returns the undo. */
export function installXhrShim(): () => void {
  const g = globalThis as { XMLHttpRequest?: unknown };
  const previous = g.XMLHttpRequest;
  g.XMLHttpRequest = FetchXhr;
  return () => {
    g.XMLHttpRequest = previous;
  };
}
