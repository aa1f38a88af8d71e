/** @type {import('prettier').Config} */
export default {
  singleQuote: true,
  printWidth: 120,
  plugins: ['prettier-plugin-astro', 'prettier-plugin-tailwindcss'],
  tailwindStylesheet: './src/styles/global.css',
  overrides: [
    {
      files: '*.astro',
      // Strict: the Astro printer otherwise adds spaces inside inline elements and between them, which
      // changes the text a page renders ("Owner" became " Owner ").
      options: { parser: 'astro', htmlWhitespaceSensitivity: 'strict' },
    },
  ],
};
