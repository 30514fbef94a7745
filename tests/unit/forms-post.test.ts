import { describe, expect, it } from "vitest";
import { execFileSync } from "node:child_process";
import { readFileSync } from "node:fs";

/**
 * A form that JavaScript submits (onSubmit) must still say method="post": before the page's scripts run, or
 * without them, the browser submits it on its own, and a form without a method is sent as a GET with every
 * field (passwords included) in the address, the history and access logs (HTML Living Standard, form
 * submission: the default method is GET). Search forms are GET on purpose (role="search").
 */
function formTags(source: string): string[] {
  const tags: string[] = [];
  let i = 0;
  for (;;) {
    const j = source.indexOf("<form", i);
    if (j < 0) return tags;
    if (!/\s/.test(source[j + 5] ?? "")) {
      i = j + 5;
      continue;
    }
    let k = j;
    let depth = 0;
    for (; k < source.length; k++) {
      const c = source[k];
      if (c === "{") depth++;
      else if (c === "}") depth--;
      else if (c === ">" && depth === 0) break;
    }
    tags.push(source.slice(j, k + 1));
    i = k + 1;
  }
}

describe("forms submitted by script", () => {
  const files = execFileSync("git", ["ls-files", "app", "components"], { encoding: "utf8" })
    .split("\n")
    .filter((f) => f.endsWith(".tsx"));
  const tags = files.flatMap((f) => formTags(readFileSync(f, "utf8")).map((tag) => ({ f, tag })));

  it("finds the app's forms (the scan itself works)", () => {
    expect(tags.some((t) => t.f.endsWith("password-form.tsx"))).toBe(true);
    expect(formTags('<form onSubmit={(e) => { go(e); }} className="x">')).toEqual(['<form onSubmit={(e) => { go(e); }} className="x">']);
  });

  it("say method=\"post\" unless a server action (React sets the method) or a search form", () => {
    const missing = tags
      .filter(({ tag }) => /onSubmit=/.test(tag) && !/action=\{/.test(tag) && !/role="search"/.test(tag))
      .filter(({ tag }) => !/method="post"/.test(tag))
      .map(({ f }) => f);
    expect(missing).toEqual([]);
  });
});
