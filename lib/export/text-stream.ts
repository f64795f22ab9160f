/**
 * Text chunks as a byte stream for a Response body. The next chunk is made only when the reader
 * asks for it, so an export of a large spectrum is written while it is sent, never held whole.
 */
export function textStream(chunks: Iterable<string>): ReadableStream<Uint8Array> {
  const it = chunks[Symbol.iterator]();
  const encoder = new TextEncoder();
  return new ReadableStream<Uint8Array>(
    {
      pull(controller) {
        const next = it.next();
        if (next.done) controller.close();
        else controller.enqueue(encoder.encode(next.value));
      },
      cancel() {
        it.return?.();
      },
    },
    { highWaterMark: 1 },
  );
}
