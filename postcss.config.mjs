// Tailwind CSS runs as a PostCSS plugin (Next reads this file when it builds the styles).
const config = { plugins: { "@tailwindcss/postcss": {} } };

export default config;
