// Bundles the larder command into one JavaScript file, so it starts fast without a TypeScript loader.
import { build } from 'esbuild';

await build({
  entryPoints: ['cli/main.ts'],
  outfile: 'dist/cli/larder.js',
  bundle: true,
  platform: 'node',
  format: 'esm',
  target: 'node20',
  sourcemap: true,
  legalComments: 'none',
  logLevel: 'warning',
  // Bundled CommonJS packages (ajv) call require(); give the ES module bundle one.
  banner: {
    js: "import { createRequire as __larderRequire } from 'node:module'; const require = __larderRequire(import.meta.url);",
  },
});
