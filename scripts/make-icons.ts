/**
 * Renders public/icon.svg (LoopLedger's mark) into the raster icons browsers and phones ask for:
 * favicon.ico (16, 32 and 48 px PNGs in one ICO), apple-touch-icon.png (180 px), icon-192.png and
 * icon-512.png. Uses the machine's Chromium through playwright-core; run after changing the SVG:
 *
 *   npx tsx scripts/make-icons.ts
 *
 * ICO layout: a 6-byte header, one 16-byte entry per image, then the PNG data (PNG-in-ICO, read by every
 * current browser).
 */
import { readFileSync, writeFileSync } from "node:fs";
import { resolve } from "node:path";
import { chromium } from "playwright-core";

const root = resolve(__dirname, "..");
const svg = readFileSync(resolve(root, "public/icon.svg"), "utf8");

async function main() {
  const browser = await chromium.launch({ executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium", headless: true, args: ["--no-sandbox", "--disable-gpu"] });
  const page = await browser.newPage();
  const png = async (size: number) => {
    await page.setViewportSize({ width: size, height: size });
    await page.setContent(`<html><body style="margin:0;background:transparent">${svg.replace("<svg ", `<svg width="${size}" height="${size}" `)}</body></html>`);
    return page.screenshot({ omitBackground: true, clip: { x: 0, y: 0, width: size, height: size } });
  };
  writeFileSync(resolve(root, "public/apple-touch-icon.png"), await png(180));
  writeFileSync(resolve(root, "public/icon-192.png"), await png(192));
  writeFileSync(resolve(root, "public/icon-512.png"), await png(512));
  const sizes = [16, 32, 48];
  const images = [];
  for (const s of sizes) images.push(await png(s));
  await browser.close();
  const header = Buffer.alloc(6);
  header.writeUInt16LE(0, 0);
  header.writeUInt16LE(1, 2);
  header.writeUInt16LE(images.length, 4);
  let offset = 6 + 16 * images.length;
  const entries = images.map((img, i) => {
    const e = Buffer.alloc(16);
    e.writeUInt8(sizes[i]!, 0);
    e.writeUInt8(sizes[i]!, 1);
    e.writeUInt8(0, 2);
    e.writeUInt8(0, 3);
    e.writeUInt16LE(1, 4);
    e.writeUInt16LE(32, 6);
    e.writeUInt32LE(img.length, 8);
    e.writeUInt32LE(offset, 12);
    offset += img.length;
    return e;
  });
  writeFileSync(resolve(root, "public/favicon.ico"), Buffer.concat([header, ...entries, ...images]));
  console.log("wrote public/favicon.ico, apple-touch-icon.png, icon-192.png, icon-512.png");
}

void main();
