/**
 * Turn the report's React tree into plain data (react-pdf primitive type strings, props, children) so it
 * can be posted to a worker thread and rendered there. Our components are pure functions without hooks,
 * so calling them expands the tree; the one function prop react-pdf needs (the page-number `render`)
 * travels as a marker the worker puts back.
 */
import { Fragment, isValidElement, type ReactNode } from "react";

export type SerialNode = string | { t: string; p: Record<string, unknown>; c: SerialNode[] };

/** Marker for `<Text render={...}>` that prints "Page n of N". */
export const PAGE_OF_MARKER = "__pageOf";

export function serializeTree(node: ReactNode): SerialNode[] {
  if (node === null || node === undefined || typeof node === "boolean") return [];
  if (typeof node === "string") return [node];
  if (typeof node === "number" || typeof node === "bigint") return [String(node)];
  if (Array.isArray(node)) return node.flatMap((n) => serializeTree(n as ReactNode));
  if (!isValidElement(node)) throw new Error("report tree: unsupported node");
  const { type } = node;
  const props = (node.props ?? {}) as Record<string, unknown> & { children?: ReactNode };
  if (type === Fragment) return serializeTree(props.children);
  if (typeof type === "function") {
    const rendered = (type as (p: unknown) => ReactNode)(props);
    return serializeTree(rendered);
  }
  if (typeof type !== "string") throw new Error("report tree: unsupported element type");
  const p: Record<string, unknown> = {};
  for (const [k, v] of Object.entries(props)) {
    if (k === "children") continue;
    if (typeof v === "function") {
      if (k === "render") {
        p[PAGE_OF_MARKER] = true;
        continue;
      }
      throw new Error(`report tree: function prop ${k} cannot cross to the worker`);
    }
    p[k] = v;
  }
  return [{ t: type, p, c: serializeTree(props.children) }];
}
