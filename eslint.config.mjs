import nextVitals from 'eslint-config-next/core-web-vitals';
import nextTs from 'eslint-config-next/typescript';

const LIB_NOT_UP = {
  group: ['@/components/*', '@/app/*', '**/components/*', '**/app/*'],
  message: 'lib must not import components or app: move the shared piece into lib.',
};

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
      'no-restricted-imports': ['error', { patterns: [LIB_NOT_UP] }],
    },
  },
  // The query layer is SQL and mapping only and hands data up: the services above it (src/lib/quotes/,
  // src/lib/auth/, src/lib/ranking/) call it, send e-mail and take payments, never the reverse. One block for
  // all three: a later block's no-restricted-imports replaces an earlier one for the same file, so the lib
  // rule is repeated here too.
  {
    files: ['src/lib/db/**/*.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            LIB_NOT_UP,
            {
              group: [
                '@/lib/mail',
                '@/lib/mail.*',
                '@/lib/payments',
                '@/lib/payments.*',
                '**/lib/mail',
                '**/lib/payments',
                '../../mail',
                '../../payments',
              ],
              message:
                'db/queries holds SQL and mapping only: call mail and payments from src/lib/quotes/ (or another service module).',
            },
            {
              group: ['@/lib/ranking', '@/lib/ranking/*', '**/ranking/*', '**/ranking'],
              message:
                'db/queries must not call the ranking service: let the caller rank and pass the result in (src/lib/ranking calls the queries).',
            },
          ],
        },
      ],
    },
  },
  // Components (client ones above all) never reach the query layer or a server-only service, not even
  // for a type: response shapes live in src/lib/<area>/types.ts.
  {
    files: ['src/components/**/*.ts', 'src/components/**/*.tsx'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            {
              group: [
                '@/lib/db',
                '@/lib/db/*',
                '**/lib/db/*',
                '@/lib/ranking/*',
                '!@/lib/ranking/types',
                '@/lib/mail',
                '@/lib/payments',
              ],
              message:
                'components import response types from src/lib/<area>/types.ts, never db, the ranking service, mail or payments.',
            },
          ],
        },
      ],
    },
  },
  // The quote flows decide and the query layer writes: a flow hands a locked row to a named write in
  // src/lib/db/queries/ (quote-writes.ts, quote-payments.ts, quote-lifecycle.ts), never saves it itself.
  {
    files: ['src/lib/quotes/**/*.ts'],
    rules: {
      'no-restricted-syntax': [
        'error',
        {
          selector:
            "CallExpression[callee.type='MemberExpression'][callee.property.name=/^(save|reload|changed|destroy|increment|decrement)$/]",
          message:
            'lib/quotes does not write model rows: call a named write in src/lib/db/queries/ (e.g. quote-writes.ts) inside the transaction.',
        },
        {
          selector: "CallExpression[callee.type='MemberExpression'][callee.property.name='set'][arguments.length=1]",
          message:
            'lib/quotes does not set fields on model rows: call a named write in src/lib/db/queries/ (e.g. quote-writes.ts) inside the transaction.',
        },
      ],
    },
  },
  // The advisor is a pure module: no database, React, Next or outside services.
  {
    files: ['src/lib/advisor/**/*.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          paths: ['react', 'next', 'sequelize'],
          patterns: [
            {
              group: ['@/components/*', '@/app/*', '@/lib/db/*', 'next/*', '@/lib/mail*', '@/lib/payments*'],
              message: 'the advisor stays pure (docs/advisor.md): no database, React, Next or services.',
            },
          ],
        },
      ],
    },
  },
];

export default config;
