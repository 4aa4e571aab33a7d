/**
 * Layer rules for Mixwise, checked by `npm run lint` (dependency-cruiser) and in CI (.ci/run).
 *
 *   engine   the model; imports no other layer and no platform module
 *   report   the printable report; imports only the engine
 *   shared   contracts between the programs (host API, IPC channels, commands); imports only
 *            the engine and the report
 *   cli, main, preload, renderer   the programs; import engine, report and shared, never each other
 *
 * Outside the engine, the engine is reached only through src/engine/index.ts. No import cycles,
 * type-only imports included. DEVELOPERS.md explains the layers.
 */
const PROGRAMS = '(cli|main|preload|renderer)';
/** npm packages the engine may use: its schema and matrix libraries. */
const ENGINE_PACKAGES = '^node_modules/(zod|ml-matrix)/';
/** Shared modules that use Node (for the CLI and the main process only). */
const NODE_SHARED = '^src/shared/atomicWrite\\.ts$';

/** @type {import('dependency-cruiser').IConfiguration} */
module.exports = {
  forbidden: [
    {
      name: 'no-cycles',
      comment: 'An import cycle (type-only imports count too): split out the shared part into its own module.',
      severity: 'error',
      from: {},
      to: { circular: true },
    },
    {
      name: 'engine-is-a-leaf-layer',
      comment: 'The engine imports no other layer of the program.',
      severity: 'error',
      from: { path: '^src/engine/' },
      to: { path: '^src/', pathNot: '^src/engine/' },
    },
    {
      name: 'engine-no-platform',
      comment: 'The engine runs anywhere (Node, worker, browser): no Node built-ins and no npm package but its schema and matrix libraries.',
      severity: 'error',
      from: { path: '^src/engine/' },
      to: { dependencyTypes: ['core', 'npm', 'npm-dev', 'npm-optional', 'npm-peer', 'npm-no-pkg', 'npm-unknown'], pathNot: ENGINE_PACKAGES },
    },
    {
      name: 'report-imports-only-the-engine',
      comment: 'The report is pure: it imports the engine and nothing else of the program, and no Node built-ins.',
      severity: 'error',
      from: { path: '^src/report/' },
      to: { path: '^src/', pathNot: '^src/(engine|report)/' },
    },
    {
      name: 'report-no-platform',
      comment: 'The report runs in the app and the CLI alike: no Node built-ins, no electron, no svelte.',
      severity: 'error',
      from: { path: '^src/report/' },
      to: { dependencyTypes: ['core'] },
    },
    {
      name: 'shared-imports-only-lower-layers',
      comment: 'Contracts between the programs depend on the engine and the report at most.',
      severity: 'error',
      from: { path: '^src/shared/' },
      to: { path: '^src/', pathNot: '^src/(engine|report|shared)/' },
    },
    {
      name: 'programs-do-not-import-each-other',
      comment: 'cli, main, preload and renderer meet only through src/shared (contracts) and the layers below.',
      severity: 'error',
      from: { path: `^src/${PROGRAMS}/` },
      to: { path: `^src/${PROGRAMS}/`, pathNot: '^src/$1/' },
    },
    {
      name: 'engine-through-its-index',
      comment: 'Outside the engine, import it through src/engine/index.ts, its only public door.',
      severity: 'error',
      from: { path: '^src/', pathNot: '^src/engine/' },
      to: { path: '^src/engine/', pathNot: '^src/engine/index\\.ts$' },
    },
    {
      name: 'renderer-no-node',
      comment: 'The renderer runs in a sandboxed page: no Node built-ins.',
      severity: 'error',
      from: { path: '^src/(renderer|preload)/' },
      to: { dependencyTypes: ['core'], pathNot: '^electron$' },
    },
    {
      name: 'renderer-no-node-shared',
      comment: 'The renderer and preload cannot use the shared modules written for Node (CLI and main process).',
      severity: 'error',
      from: { path: '^src/(renderer|preload)/' },
      to: { path: NODE_SHARED },
    },
    {
      name: 'shared-node-only-where-listed',
      comment: 'A shared module that uses Node must be listed in NODE_SHARED so the renderer rule covers it.',
      severity: 'error',
      from: { path: '^src/shared/', pathNot: NODE_SHARED },
      to: { dependencyTypes: ['core'] },
    },
    {
      name: 'not-to-unresolvable',
      comment: 'An import that resolves to no file.',
      severity: 'error',
      from: {},
      to: { couldNotResolve: true },
    },
  ],
  options: {
    tsPreCompilationDeps: true,
    tsConfig: { fileName: 'tsconfig.json' },
    doNotFollow: { path: 'node_modules' },
    exclude: { path: '(^|/)node_modules/' },
    enhancedResolveOptions: { extensions: ['.ts', '.js', '.mjs', '.svelte', '.json'], exportsFields: ['exports'], conditionNames: ['import', 'require', 'node', 'default', 'types'] },
    reporterOptions: { text: { highlightFocused: true } },
  },
};
