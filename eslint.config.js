import js from '@eslint/js';
import { defineConfig } from 'eslint/config';
import astro from 'eslint-plugin-astro';
import jsxA11y from 'eslint-plugin-jsx-a11y';
import reactHooks from 'eslint-plugin-react-hooks';
import globals from 'globals';
import tseslint from 'typescript-eslint';

/**
 * Type-aware lint for TypeScript and React; Astro's own rules and the accessibility rules for .astro
 * templates. Type-aware rules need a TypeScript program, which .astro and plain .js/.mjs files are not
 * part of, so those get the same rules without type information.
 */
export default defineConfig(
  { ignores: ['dist/', 'node_modules/', '.astro/', 'data/', 'drizzle/', 'test-results/'] },
  js.configs.recommended,
  tseslint.configs.recommendedTypeChecked,
  {
    languageOptions: {
      globals: { ...globals.node, ...globals.browser },
      parserOptions: { projectService: true, tsconfigRootDir: import.meta.dirname },
    },
    rules: {
      // `_name` marks a parameter kept for its position (an Astro or React signature).
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
      '@typescript-eslint/consistent-type-imports': ['error', { fixStyle: 'inline-type-imports' }],
      // `onSubmit={form.handleSubmit(save)}` and `onClick={async () => …}` are React's way; a failure is
      // handled inside each handler, never left to the event.
      '@typescript-eslint/no-misused-promises': ['error', { checksVoidReturn: { attributes: false } }],
    },
  },
  {
    // eslint-plugin-astro's accessibility config below registers the jsx-a11y plugin; here its rules reach JSX too.
    files: ['**/*.tsx'],
    rules: jsxA11y.flatConfigs.recommended.rules,
  },
  {
    files: ['**/*.tsx', '**/*.ts'],
    plugins: { 'react-hooks': reactHooks },
    // The two rules of hooks. The React Compiler's rules in the plugin's newer presets are left out: the app
    // does not use the compiler, and they read react-hook-form's `field` objects as refs.
    rules: { 'react-hooks/rules-of-hooks': 'error', 'react-hooks/exhaustive-deps': 'error' },
  },
  {
    // Tests read API answers as untyped JSON (`await res.json()`); the assertions are the type check there.
    files: ['tests/**', 'bench/**'],
    rules: {
      '@typescript-eslint/no-unsafe-member-access': 'off',
      '@typescript-eslint/no-unsafe-assignment': 'off',
      '@typescript-eslint/no-unsafe-argument': 'off',
      '@typescript-eslint/no-unsafe-call': 'off',
      '@typescript-eslint/no-unsafe-return': 'off',
      '@typescript-eslint/no-explicit-any': 'off',
      // Database cells and mail parts are printed as they come in assertion messages.
      '@typescript-eslint/no-base-to-string': 'off',
      // Fakes of async interfaces (fetch, the draft store) answer at once.
      '@typescript-eslint/require-await': 'off',
    },
  },
  {
    // Ambient declarations cannot import without becoming modules.
    files: ['**/*.d.ts'],
    rules: { '@typescript-eslint/consistent-type-imports': 'off' },
  },
  ...astro.configs['flat/recommended'],
  ...astro.configs['flat/jsx-a11y-recommended'],
  {
    // A scrollable table box is a labelled region that keyboard users must be able to focus to scroll
    // (WCAG 2.1.1; axe's scrollable-region-focusable).
    rules: {
      'jsx-a11y/no-noninteractive-tabindex': ['error', { roles: ['region'] }],
      'astro/jsx-a11y/no-noninteractive-tabindex': ['error', { roles: ['region'] }],
    },
  },
  {
    files: ['**/*.astro', '**/*.js', '**/*.mjs', '**/*.cjs'],
    ...tseslint.configs.disableTypeChecked,
  },
);
