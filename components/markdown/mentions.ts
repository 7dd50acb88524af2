/**
 * A rehype step that wraps @handles in text (not inside code, pre or links) in <span class="mention">, so a
 * mention stands out in a thread. A tree walk of a few lines; the markdown packages do not offer it.
 */
interface Node {
  type: string;
  tagName?: string;
  value?: string;
  properties?: Record<string, unknown>;
  children?: Node[];
}

const MENTION = /(^|[\s(])(@[A-Za-z0-9][A-Za-z0-9._-]*)/g;
const SKIP = new Set(["code", "pre", "a"]);

function split(text: string): Node[] {
  const out: Node[] = [];
  let last = 0;
  for (const m of text.matchAll(MENTION)) {
    const at = (m.index ?? 0) + m[1].length;
    if (at > last) out.push({ type: "text", value: text.slice(last, at) });
    out.push({ type: "element", tagName: "span", properties: { className: ["mention"] }, children: [{ type: "text", value: m[2] }] });
    last = at + m[2].length;
  }
  if (last < text.length) out.push({ type: "text", value: text.slice(last) });
  return out;
}

function walk(node: Node): void {
  if (!node.children || (node.tagName && SKIP.has(node.tagName))) return;
  node.children = node.children.flatMap((child) => {
    if (child.type === "text" && child.value && MENTION.test(child.value)) {
      MENTION.lastIndex = 0;
      return split(child.value);
    }
    MENTION.lastIndex = 0;
    walk(child);
    return [child];
  });
}

/** The rehype plugin. */
export function rehypeMentions() {
  return (tree: Node) => walk(tree);
}
