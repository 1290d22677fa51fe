/** Asks `ok` every 200 ms until it holds (true) or `seconds` have passed (false). */
export async function waitFor(ok: () => Promise<boolean>, seconds: number): Promise<boolean> {
  const until = Date.now() + seconds * 1000;
  while (Date.now() < until) {
    if (await ok()) return true;
    await new Promise((r) => setTimeout(r, 200));
  }
  return false;
}
