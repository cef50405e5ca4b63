// Lint rules. The important one: shared-core stays pure (no DOM, Node, Electron or React),
// so layout and verification run the same in the app, the CLI and the tests.
import js from '@eslint/js';
import tseslint from 'typescript-eslint';

const impureModules = ['electron', 'react', 'react-dom', 'fs', 'path', 'os', 'child_process', 'zlib', 'crypto', 'url', 'buffer', 'stream', 'worker_threads', 'pngjs', 'jpeg-js', '@resvg/resvg-js', 'write-file-atomic'];

export default tseslint.config(
  { ignores: ['node_modules/**', 'out/**', 'dist/**', 'coverage/**', 'test-results/**', 'assets/**/*.js'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
    },
  },
  {
    files: ['bin/**/*.js', 'scripts/**/*.js', '*.js'],
    languageOptions: { globals: { URL: 'readonly', console: 'readonly', process: 'readonly' } },
  },
  {
    files: ['shared-core/**/*.ts'],
    rules: {
      'no-restricted-imports': ['error', {
        paths: impureModules.map((name) => ({ name, message: 'shared-core is pure: move I/O and platform code to main/ or renderer/.' })),
        patterns: [
          { group: ['node:*'], message: 'shared-core imports no Node built-ins.' },
          { group: ['**/main/**', '**/renderer/**', '../main', '../renderer'], message: 'shared-core never imports main/ or renderer/.' },
        ],
      }],
      'no-restricted-globals': ['error', 'window', 'document', 'process', 'Buffer', 'require', 'navigator', 'fetch', 'localStorage', '__dirname'],
    },
  },
);
