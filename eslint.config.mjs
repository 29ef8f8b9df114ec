import nextVitals from 'eslint-config-next/core-web-vitals';
import nextTs from 'eslint-config-next/typescript';

const config = [
  ...nextVitals,
  ...nextTs,
  { ignores: ['.next/**', 'node_modules/**', 'var/**', 'next-env.d.ts', 'coverage/**'] },
  {
    files: ['database/**/*.js', 'database/**/*.cjs', 'docker-local/**/*.mjs', '.sequelizerc'],
    rules: { '@typescript-eslint/no-require-imports': 'off' },
  },
  // Layers point down only: lib never reaches up into components or app.
  {
    files: ['src/lib/**/*.ts', 'src/lib/**/*.tsx'],
    rules: {
      'no-restricted-imports': ['error', { patterns: [{ group: ['@/components/*', '@/app/*', '**/components/*', '**/app/*'], message: 'lib must not import components or app: move the shared piece into lib.' }] }],
    },
  },
  // The query layer is SQL and mapping only: e-mail and payments are called from the services above it
  // (src/lib/quotes/, src/lib/auth/). Repeats the lib rule: a later block replaces the rule, not adds to it.
  {
    files: ['src/lib/db/queries/**/*.ts'],
    rules: {
      'no-restricted-imports': ['error', {
        patterns: [
          { group: ['@/components/*', '@/app/*', '**/components/*', '**/app/*'], message: 'lib must not import components or app: move the shared piece into lib.' },
          { group: ['@/lib/mail', '@/lib/mail.*', '@/lib/payments', '@/lib/payments.*', '**/lib/mail', '**/lib/payments', '../../mail', '../../payments'], message: 'db/queries holds SQL and mapping only: call mail and payments from src/lib/quotes/ (or another service module).' },
        ],
      }],
    },
  },
  // The advisor is a pure module: no database, React, Next or outside services.
  {
    files: ['src/lib/advisor/**/*.ts'],
    rules: {
      'no-restricted-imports': ['error', {
        paths: ['react', 'next', 'sequelize'],
        patterns: [{ group: ['@/components/*', '@/app/*', '@/lib/db/*', 'next/*', '@/lib/mail*', '@/lib/payments*'], message: 'the advisor stays pure (docs/advisor.md): no database, React, Next or services.' }],
      }],
    },
  },
];

export default config;
