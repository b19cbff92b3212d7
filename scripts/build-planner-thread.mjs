// Bundles the planner thread's entry (lib/planner-thread/entry.ts) into .next/planner-thread.mjs with
// esbuild, for lib/planner-thread/index.ts. HiGHS stays outside the bundle: its WebAssembly file is found
// next to its module in node_modules. Run by every build (scripts/lib.sh ensure_build, npm run build);
// the tests import bundlePlannerThread to make their own copy.
import { build } from 'esbuild';
import { pathToFileURL } from 'node:url';

export async function bundlePlannerThread(outfile = '.next/planner-thread.mjs') {
  await build({
    entryPoints: ['lib/planner-thread/entry.ts'],
    outfile,
    bundle: true,
    platform: 'node',
    format: 'esm',
    target: 'node20',
    external: ['highs'],
    tsconfig: 'tsconfig.json',
    logLevel: 'warning',
    // A CommonJS dependency inside an ES module bundle needs require.
    banner: { js: "import { createRequire as __hcRequire } from 'node:module'; const require = __hcRequire(import.meta.url);" },
  });
  return outfile;
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  await bundlePlannerThread();
  console.log('[setup] planner thread bundled (.next/planner-thread.mjs)');
}
