"use client";
/**
 * Renders user and finding markdown: GFM tables and lists, code, math (KaTeX). Sanitised with
 * rehype-sanitize before KaTeX runs, so raw HTML, scripts, event handlers and javascript: links are inert.
 */
import ReactMarkdown from "react-markdown";
import remarkGfm from "remark-gfm";
import remarkMath from "remark-math";
import rehypeKatex from "rehype-katex";
import rehypeSanitize, { defaultSchema } from "rehype-sanitize";
import { rehypeMentions } from "./mentions";

const schema = {
  ...defaultSchema,
  attributes: {
    ...defaultSchema.attributes,
    code: [...(defaultSchema.attributes?.code ?? []), ["className", /^language-./, "math-inline", "math-display"]],
    span: [...(defaultSchema.attributes?.span ?? []), ["className", "math-inline", "math-display"]],
    div: [...(defaultSchema.attributes?.div ?? []), ["className", "math-display"]],
  },
};

// units such as µm inside \text{} render well: KaTeX's strict-mode warning about them is noise
const katex: [typeof rehypeKatex, { strict: "ignore" }] = [rehypeKatex, { strict: "ignore" }];

export function MarkdownView({ source, className = "", mentions = false }: { source: string; className?: string; mentions?: boolean }) {
  return (
    <div className={`markdown ${className}`}>
      <ReactMarkdown
        remarkPlugins={[remarkGfm, remarkMath]}
        rehypePlugins={mentions ? [[rehypeSanitize, schema], rehypeMentions, katex] : [[rehypeSanitize, schema], katex]}
      >
        {source}
      </ReactMarkdown>
    </div>
  );
}
