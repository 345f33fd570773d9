// Waits for a freshly spawned server: the browser suite's globalSetup and the benches start the real server
// in a child process and must not talk to it before it answers.

/** Polls `url` (every 200 ms) until it answers 2xx; throws after `timeoutMs`. */
export async function waitForHealth(url: string, timeoutMs: number): Promise<void> {
  const until = Date.now() + timeoutMs
  while (Date.now() < until) {
    try {
      if ((await fetch(url)).ok) return
    } catch {
      /* not up yet */
    }
    await new Promise((r) => setTimeout(r, 200))
  }
  throw new Error(`server did not answer ${url} within ${timeoutMs} ms`)
}
