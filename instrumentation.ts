/** Server start: the periodic mail sender (lib/mail/worker.ts), Node.js runtime only. */
export async function register() {
  if (process.env.NEXT_RUNTIME !== "nodejs") return;
  const { startMailWorker } = await import("./lib/mail/worker");
  startMailWorker();
}
