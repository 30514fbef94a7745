// Worker thread that renders a serialized report tree to PDF bytes, so a long layout never blocks the
// server's event loop. Plain JavaScript on purpose: it runs outside the Next bundle (see offthread.ts).
import path from "node:path";
import { parentPort, workerData } from "node:worker_threads";
import React from "react";
import { Font, renderToBuffer } from "@react-pdf/renderer";

const { fontsDir, faces, marker } = workerData;
Font.register({
  family: "Plex Sans",
  fonts: faces.map((f) => ({
    src: path.join(fontsDir, f.file),
    fontWeight: f.fontWeight,
    ...(f.fontStyle ? { fontStyle: f.fontStyle } : {}),
  })),
});
Font.registerHyphenationCallback((word) => [word]);

const pageOf = ({ pageNumber, totalPages }) => `Page ${pageNumber} of ${totalPages}`;

function build(node) {
  if (typeof node === "string") return node;
  const props = { ...node.p };
  if (props[marker]) {
    delete props[marker];
    props.render = pageOf;
  }
  return React.createElement(node.t, props, ...node.c.map(build));
}

parentPort.on("message", async ({ id, tree }) => {
  try {
    const t0 = performance.now();
    const buf = await renderToBuffer(build(tree));
    const bytes = new Uint8Array(buf);
    parentPort.postMessage({ id, ok: true, pdf: bytes, ms: performance.now() - t0 }, [bytes.buffer]);
  } catch (e) {
    parentPort.postMessage({ id, ok: false, error: String(e && e.stack ? e.stack : e) });
  }
});
