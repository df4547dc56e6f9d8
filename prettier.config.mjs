/** The code's one look, checked by `npm run lint` (Prettier decides; nobody argues about commas). */
export default {
  plugins: ['prettier-plugin-astro'],
  printWidth: 140,
  singleQuote: true,
  overrides: [{ files: '*.astro', options: { parser: 'astro' } }],
};
