import { describe, expect, it } from "vitest";
import { ACTION_MAX_DEPTH, checkMultipartReply, checkNoScriptForm, checkTextReply, hasNoScriptActionFields, sameOriginAction } from "@/lib/http/action-envelope";

// What React's client encoder (encodeReply) sends for plain arguments, written out by hand: a JSON list of
// arguments; "$" strings are escapes ("$$"), inline values ("$undefined", "$NaN", "$D<date>", "$n<digits>")
// or references to other numbered parts of a multipart body ("$K1" a FormData, "$@2" a promise, "$3" a value).
describe("server-action envelopes", () => {
  it("lets through what the client encoder produces", () => {
    expect(checkTextReply(JSON.stringify(["p", "s", { revision: 3, name: "$$dollar", note: "$undefined", x: "$NaN", d: "$D2026-12-02T00:00:00.000Z", n: "$n12" }]))).toEqual({ ok: true });
    expect(checkTextReply("[]")).toEqual({ ok: true });
    const form = new FormData();
    form.append("0", JSON.stringify(["project-id", { ok: true }, "$K1"]));
    form.append("1_email", "someone@example.test");
    form.append("1_role", "owner");
    expect(checkMultipartReply(form)).toEqual({ ok: true });
  });

  it("refuses broken JSON, a root that is not a list, too many arguments", () => {
    expect(checkTextReply('["a", {"b": ')).toMatchObject({ ok: false, status: 400 });
    expect(checkTextReply('{"a": 1}')).toMatchObject({ ok: false, status: 400 });
    expect(checkTextReply(JSON.stringify(new Array(1001).fill(1)))).toMatchObject({ ok: false, status: 400 });
  });

  it(`refuses nesting deeper than ${ACTION_MAX_DEPTH} levels (without overflowing its own stack)`, () => {
    expect(checkTextReply("[".repeat(ACTION_MAX_DEPTH) + "]".repeat(ACTION_MAX_DEPTH))).toEqual({ ok: true });
    expect(checkTextReply("[".repeat(ACTION_MAX_DEPTH + 2) + "]".repeat(ACTION_MAX_DEPTH + 2))).toMatchObject({ ok: false, status: 400 });
    const deep = '{"a":'.repeat(100_000) + "1" + "}".repeat(100_000);
    expect(checkTextReply(deep)).toMatchObject({ ok: false, status: 400 });
  });

  it("refuses references to parts that were not sent, unknown $ forms and bigints that are not numbers", () => {
    for (const s of ["$@1", "$1", "$Q2", "$K5", "$h3", "$Zzz", "$n12abc", "$", "$?"]) {
      expect(checkTextReply(JSON.stringify([s])), s).toMatchObject({ ok: false, status: 400 });
    }
    const form = new FormData();
    form.append("0", JSON.stringify(["$@7"]));
    expect(checkMultipartReply(form)).toMatchObject({ ok: false, status: 400 });
    const noRoot = new FormData();
    noRoot.append("1_email", "x");
    expect(checkMultipartReply(noRoot)).toMatchObject({ ok: false, status: 400 });
  });

  it("refuses __proto__ keys (React's reviver would make them the object's prototype)", () => {
    expect(checkTextReply('[{"__proto__": {"admin": true}}]')).toMatchObject({ ok: false, status: 400 });
    expect(checkTextReply('[{"constructor": 1, "prototype": 2}]')).toEqual({ ok: true });
  });

  it("tells a form posted without JavaScript ($ACTION_ fields) from a fetch action's numbered parts", () => {
    const noScript = new FormData();
    noScript.set("$ACTION_ID_7f00", "");
    noScript.set("currentPassword", "x");
    expect(hasNoScriptActionFields(noScript)).toBe(true);
    const fetched = new FormData();
    fetched.set("0", '["$K1"]');
    fetched.set("1_currentPassword", "x");
    expect(hasNoScriptActionFields(fetched)).toBe(false);
  });
  it("lets through the password form as the browser sends it (fields named _1_<field>, root [null, \"$K1\"])", () => {
    // Captured from Chromium 156 submitting the account page's password form (React 19.3 client).
    const form = new FormData();
    form.set("_1_currentPassword", "not-my-password-at-all");
    form.set("_1_newPassword", "a-new-long-passphrase-2026");
    form.set("_1_confirmPassword", "a-new-long-passphrase-2026");
    form.set("0", '[null,"$K1"]');
    expect(checkMultipartReply(form)).toEqual({ ok: true });
    const missing = new FormData();
    missing.set("0", '[null,"$K1","$@2"]');
    missing.set("_1_x", "y");
    expect(checkMultipartReply(missing)).toMatchObject({ ok: false, status: 400 });
  });
  it("checks a form posted without JavaScript: bound arguments must refer to parts that were sent", () => {
    const good = new FormData();
    good.set("$ACTION_REF_1", "");
    good.set("$ACTION_1:0", '{"id":"60913784870dbe02a05dc1f53e3e010c90d3943ca9","bound":"$@1"}');
    good.set("$ACTION_1:1", '["7f1c0c5e-0000-4000-8000-000000000000"]');
    good.set("$ACTION_KEY", "k1");
    good.set("email", "someone@example.test");
    expect(checkNoScriptForm(good)).toEqual({ ok: true });
    const plain = new FormData();
    plain.set("$ACTION_ID_60913784870dbe02a05dc1f53e3e010c90d3943ca9", "");
    expect(checkNoScriptForm(plain)).toEqual({ ok: true });
    for (const meta of ['{"id":"a","bound":"$@5"}', '{"id":"a","bound":["$Q9"]}', "{broken", '{"bound":null}']) {
      const f = new FormData();
      f.set("$ACTION_REF_1", "");
      f.set("$ACTION_1:0", meta);
      expect(checkNoScriptForm(f), meta).toMatchObject({ ok: false, status: 400 });
    }
  });
  it("refuses a byte-order mark before the JSON (the framework's parser does)", () => {
    expect(checkTextReply('\uFEFF["a"]')).toMatchObject({ ok: false, status: 400 });
  });

  it("compares the Origin's host with X-Forwarded-Host, else Host, as Next.js does", () => {
    const h = (o: Record<string, string>) => new Headers(o);
    expect(sameOriginAction(h({ host: "127.0.0.1:3000" }))).toBe(true);
    expect(sameOriginAction(h({ host: "127.0.0.1:3000", origin: "http://127.0.0.1:3000" }))).toBe(true);
    expect(sameOriginAction(h({ host: "127.0.0.1:3000", origin: "http://evil.example" }))).toBe(false);
    expect(sameOriginAction(h({ host: "10.0.0.5:3000", "x-forwarded-host": "ledger.example", origin: "https://ledger.example" }))).toBe(true);
    expect(sameOriginAction(h({ host: "127.0.0.1:3000", origin: "null" }))).toBe(false);
    expect(sameOriginAction(h({ host: "127.0.0.1:3000", origin: "not a url" }))).toBe(false);
  });
});
