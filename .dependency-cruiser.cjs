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

/**
 * The layering rules, one a row: name, the files it applies to (`!` before the pattern: every file but those), the
 * files they may not import, and why.
 */
const LAYER_RULES = [
  [
    'shared-stays-shared',
    '^shared/',
    '^(app|components|scenes|server|tests)/',
    'shared/ (core and schemas) runs on both sides: it imports nothing from app, components, scenes, server or tests.',
  ],
  [
    'client-never-imports-server',
    '^(app|components|scenes)/',
    '^server/',
    'The client talks to the server over HTTP only (components/data), never by importing it.',
  ],
  ['server-never-imports-client', '^server/', '^(app|components|scenes)/'],
  ['routes-are-the-top', '!^app/', '^app/', 'app/ holds Expo Router routes only; nothing else imports them.'],
  [
    'scenes-below-components',
    '^scenes/',
    '^(components|app)/',
    'components/ loads scenes/ lazily; scenes get their data as props and import only shared/.',
  ],
  ['no-imports-from-tests', '!^tests/', '^tests/'],
  [
    'domain-knows-no-http-or-adapters',
    '^server/domain/',
    `^server/(routes|http)/|${SERVER_ADAPTERS}|${SERVER_COMPOSITION}`,
    'Use cases depend on repositories, the core and their ports (server/domain/ports); never on routes, HTTP, ' +
      'the adapters that implement the ports, or the composition root. Mail templates are plain text builders.',
  ],
  [
    'data-below-domain',
    '^server/data/',
    `^server/(domain|routes|http|mail)/|${SERVER_ADAPTERS}|${SERVER_COMPOSITION}`,
    'Repositories and models know nothing above them.',
  ],
  [
    'routes-through-use-cases',
    '^server/(routes|http)/',
    '^server/data/(repositories|models)/|^server/data/migrations/',
    'Routes and middleware call use cases; only use cases call repositories and models.',
  ],
  [
    'adapters-below-http',
    SERVER_ADAPTERS,
    `^server/(routes|http)/|^server/(app|start)[.]ts$|^server/seeders/`,
    'Queue, workers, storage, terrain files and mail implement ports; they never reach up into HTTP.',
  ],
];

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
    ...LAYER_RULES.map(([name, from, to, comment]) => ({
      name,
      severity: 'error',
      ...(comment ? { comment } : {}),
      from: from.startsWith('!') ? { pathNot: from.slice(1) } : { path: from },
      to: { path: to },
    })),
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
