// ESLint flat config: TypeScript, React hooks and Next's rules, Prettier for layout, and the import
// boundaries of the layer map in DEVELOPERS.md (what may import what).
import js from "@eslint/js";
import tseslint from "typescript-eslint";
import reactHooks from "eslint-plugin-react-hooks";
import nextPlugin from "@next/eslint-plugin-next";
import prettier from "eslint-config-prettier";

const database = ["@/lib/db", "@/lib/db/*", "knex", "mysql2"];
const webApp = ["react", "react-dom", "react/*", "react-dom/*", "next", "next/*", "next-auth", "next-auth/*", "@/app/*", "@/components/*"];
const pure = [
  "lib/analysis/**",
  "lib/layout/**",
  "rules/**",
  "lib/contracts/**",
  "lib/report/markdown.ts",
  "lib/report/pdf.ts",
  "lib/report/service-sections.ts",
  "lib/report/load-case-summary.ts",
];
const restrict = (patterns, message) => ({ "no-restricted-imports": ["error", { patterns: [{ group: patterns, message }] }] });

export default tseslint.config(
  { ignores: [".next/**", "node_modules/**", "dist/**", ".data/**", "public/**", "examples/**", "test-results/**", "playwright-report/**", "next-env.d.ts"] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    plugins: { "react-hooks": reactHooks, "@next/next": nextPlugin },
    rules: {
      ...nextPlugin.configs.recommended.rules,
      ...nextPlugin.configs["core-web-vitals"].rules,
      "react-hooks/rules-of-hooks": "error",
      "react-hooks/exhaustive-deps": "error",
      "@typescript-eslint/no-unused-vars": ["error", { argsIgnorePattern: "^_", varsIgnorePattern: "^_", destructuredArrayIgnorePattern: "^_" }],
      // the App Router has no pages/ folder: the rule's page checks do not apply
      "@next/next/no-html-link-for-pages": "off",
    },
  },
  // plain Node scripts
  {
    files: ["**/*.mjs", "scripts/**"],
    languageOptions: { globals: { process: "readonly", console: "readonly", Buffer: "readonly", URL: "readonly", setTimeout: "readonly" } },
  },
  // the math, the format and the rules are pure: no database, no web app, no React
  {
    files: pure,
    rules: restrict([...database, ...webApp], "Pure layers (analysis, layout, rules, contracts, report rendering) import no database, web app or React."),
  },
  // components read contracts, never the database layer
  { files: ["components/**"], rules: restrict(database, "Components import DTO types and schemas from @/lib/contracts, never from @/lib/db.") },
  // SQL lives in lib/db: nobody else opens a connection or builds a query
  {
    files: ["app/**", "lib/**", "instrumentation.ts"],
    ignores: ["lib/db/**", ...pure],
    rules: restrict(["@/lib/db/knex", "knex", "mysql2"], "Queries live in lib/db/<entity>.ts; call a function there."),
  },
  prettier,
);
