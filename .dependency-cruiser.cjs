// Kenning's layering, checked on every `npm run lint` and `npm test` (dependency-cruiser).
//
// Client:  app/ (routes) → components/ (UI, query hooks, API client) → scenes/ (lazy 3D) → shared/
// Server:  routes/, http/ → domain/ (use cases, ports) → data/ (repositories, models) and shared/
//          queue/, workers/, storage/, terrain/, mail/ implement the domain's ports;
//          app.ts, start.ts, seeders/, scripts/ put everything together.
// Nothing imports upward, shared/ imports nothing of ours outside shared/, and there are no cycles.
//
// Violations that were there when the check came in and have an issue of their own are listed in
// .dependency-cruiser-known-violations.json; `--ignore-known` lets those pass and fails on every new one. Shrink
// the list when one is fixed: `npx depcruise --config .dependency-cruiser.cjs --output-type baseline app components
// scenes server shared tests > .dependency-cruiser-known-violations.json` (never grow it to silence a new import).

const SERVER_COMPOSITION = '^server/(app|start|config)[.]ts$|^server/(seeders|scripts)/';
const SERVER_ADAPTERS = '^server/(queue|workers|storage|terrain)/|^server/mail/(?!templates[.]ts$)';

/** @type {import('dependency-cruiser').IConfiguration} */
module.exports = {
  forbidden: [
    {
      name: 'no-circular',
      severity: 'error',
      comment:
        'Modules that import each other, directly or round a loop, cannot be understood or tested alone. ' +
        'A loop closed by a dynamic import() (the deferred chunk the first bundle loads later; with its `typeof import()` type, ' +
        'dependency-cruiser records that edge as a type import) or by a type-only import is not a load-time loop.',
      from: {},
      to: {
        circular: true,
        dependencyTypesNot: ['dynamic-import', 'type-import'],
        viaOnly: { dependencyTypesNot: ['dynamic-import', 'type-import'] },
      },
    },
    {
      name: 'shared-stays-shared',
      severity: 'error',
      comment: 'shared/ (core and schemas) runs on both sides: it imports nothing from app, components, scenes, server or tests.',
      from: { path: '^shared/' },
      to: { path: '^(app|components|scenes|server|tests)/' },
    },
    {
      name: 'client-never-imports-server',
      severity: 'error',
      comment: 'The client talks to the server over HTTP only (components/data), never by importing it.',
      from: { path: '^(app|components|scenes)/' },
      to: { path: '^server/' },
    },
    {
      name: 'server-never-imports-client',
      severity: 'error',
      from: { path: '^server/' },
      to: { path: '^(app|components|scenes)/' },
    },
    {
      name: 'routes-are-the-top',
      severity: 'error',
      comment: 'app/ holds Expo Router routes only; nothing else imports them.',
      from: { pathNot: '^app/' },
      to: { path: '^app/' },
    },
    {
      name: 'scenes-below-components',
      severity: 'error',
      comment: 'components/ loads scenes/ lazily; scenes get their data as props and import only shared/.',
      from: { path: '^scenes/' },
      to: { path: '^(components|app)/' },
    },
    {
      name: 'no-imports-from-tests',
      severity: 'error',
      from: { pathNot: '^tests/' },
      to: { path: '^tests/' },
    },
    {
      name: 'domain-knows-no-http-or-adapters',
      severity: 'error',
      comment:
        'Use cases depend on repositories, the core and their ports (server/domain/ports); never on routes, HTTP, ' +
        'the adapters that implement the ports, or the composition root. Mail templates are plain text builders.',
      from: { path: '^server/domain/' },
      to: { path: `^server/(routes|http)/|${SERVER_ADAPTERS}|${SERVER_COMPOSITION}` },
    },
    {
      name: 'data-below-domain',
      severity: 'error',
      comment: 'Repositories and models know nothing above them.',
      from: { path: '^server/data/' },
      to: { path: `^server/(domain|routes|http|mail)/|${SERVER_ADAPTERS}|${SERVER_COMPOSITION}` },
    },
    {
      name: 'routes-through-use-cases',
      severity: 'error',
      comment: 'Routes and middleware call use cases; only use cases call repositories and models.',
      from: { path: '^server/(routes|http)/' },
      to: { path: '^server/data/(repositories|models)/|^server/data/migrations/' },
    },
    {
      name: 'adapters-below-http',
      severity: 'error',
      comment: 'Queue, workers, storage, terrain files and mail implement ports; they never reach up into HTTP.',
      from: { path: SERVER_ADAPTERS },
      to: { path: `^server/(routes|http)/|^server/(app|start)[.]ts$|^server/seeders/` },
    },
  ],
  options: {
    doNotFollow: { path: 'node_modules' },
    exclude: { path: '^(node_modules|dist|[.]kenning|[.]expo|coverage)/' },
    // Type-only imports count: a use case that names an adapter's type still depends on it.
    tsPreCompilationDeps: true,
    tsConfig: { fileName: 'tsconfig.json' },
    enhancedResolveOptions: {
      exportsFields: ['exports'],
      conditionNames: ['import', 'require', 'node', 'default', 'types'],
      extensions: ['.ts', '.tsx', '.js', '.mjs', '.cjs', '.json'],
    },
    reporterOptions: { text: { highlightFocused: true } },
  },
};
