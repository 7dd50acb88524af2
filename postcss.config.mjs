/** PostCSS: Tailwind 3 reads tailwind.config.ts itself. */
export default { plugins: { tailwindcss: {}, autoprefixer: {} } };
