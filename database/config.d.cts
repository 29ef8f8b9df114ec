declare const config: {
  development: Record<string, unknown>;
  test: Record<string, unknown>;
  production: Record<string, unknown>;
  connectionSettings: () => Record<string, unknown>;
};
export = config;
