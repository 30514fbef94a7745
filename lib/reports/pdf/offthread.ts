import "server-only";
import path from "node:path";
import { Worker } from "node:worker_threads";
import type { ReportSource } from "../types";
import { ReportDocument } from "./document";
import { renderReportPdf } from "./render";
import { PAGE_OF_MARKER, serializeTree, type SerialNode } from "./serialize";
import { FONT_FACES, fontsDir } from "./theme";

/**
 * Render the PDF on a worker thread. react-pdf's layout is synchronous and takes seconds for a full
 * report; on the main thread it would stall every other request for that long. The tree is built and
 * serialized here (cheap), laid out and drawn in the worker. One long-lived worker; requests queue.
 */
interface Pending {
  resolve: (b: Buffer) => void;
  reject: (e: Error) => void;
  timer: NodeJS.Timeout;
}

const TIMEOUT_MS = 120_000;
let worker: Worker | null = null;
let nextId = 1;
const pending = new Map<number, Pending>();

function workerPath(): string {
  return path.join(/*turbopackIgnore: true*/ process.cwd(), "lib", "reports", "pdf", "worker.mjs");
}

function failAll(e: Error) {
  for (const [id, p] of pending) {
    clearTimeout(p.timer);
    p.reject(e);
    pending.delete(id);
  }
}

function getWorker(): Worker {
  if (worker) return worker;
  const w = new Worker(workerPath(), {
    workerData: { fontsDir: fontsDir(), faces: FONT_FACES, marker: PAGE_OF_MARKER },
  });
  w.unref();
  w.on("message", (m: { id: number; ok: boolean; pdf?: Uint8Array; error?: string }) => {
    const p = pending.get(m.id);
    if (!p) return;
    pending.delete(m.id);
    clearTimeout(p.timer);
    if (m.ok && m.pdf) p.resolve(Buffer.from(m.pdf.buffer, m.pdf.byteOffset, m.pdf.byteLength));
    else p.reject(new Error(m.error ?? "PDF worker failed"));
  });
  w.on("error", (e) => {
    worker = null;
    failAll(e instanceof Error ? e : new Error(String(e)));
  });
  w.on("exit", () => {
    worker = null;
    failAll(new Error("PDF worker exited"));
  });
  worker = w;
  return w;
}

export function reportTree(source: ReportSource): SerialNode {
  const [root] = serializeTree(ReportDocument({ source }));
  if (!root || typeof root === "string") throw new Error("report tree: no document");
  return root;
}

export async function renderReportPdfOffThread(source: ReportSource): Promise<Buffer> {
  let tree: SerialNode;
  let w: Worker;
  try {
    tree = reportTree(source);
    w = getWorker();
  } catch (e) {
    console.warn("report: worker unavailable, rendering on the main thread", e);
    return renderReportPdf(source);
  }
  const id = nextId++;
  return new Promise<Buffer>((resolve, reject) => {
    const timer = setTimeout(() => {
      pending.delete(id);
      reject(new Error("PDF rendering timed out"));
      void w.terminate();
    }, TIMEOUT_MS);
    pending.set(id, { resolve, reject, timer });
    w.ref();
    w.postMessage({ id, tree });
  }).finally(() => {
    if (pending.size === 0) worker?.unref();
  });
}
