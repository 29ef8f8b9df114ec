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
];

export default config;
