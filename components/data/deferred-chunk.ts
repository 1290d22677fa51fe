type DeferredChunk = typeof import('@/components/shell/deferred-screens');

let loading: Promise<DeferredChunk> | null = null;
let loaded: DeferredChunk | null = null;

/** The chunk's exports once it has loaded (null before), so later users need not wait a turn. */
export function deferredChunkIfLoaded(): DeferredChunk | null {
  return loaded;
}

/**
 * The one async chunk of the signed-in screens and of the response schemas
 * (zod with them), fetched once; a failed fetch is forgotten so the next use
 * tries again. Everything the first screen does not draw lives there: Metro's
 * web export moves modules that two async chunks share into the up-front
 * `__common` chunk, so a second lazy chunk for the schemas would bring zod
 * back into the first load.
 */
export function loadDeferredChunk(): Promise<DeferredChunk> {
  loading ??= import('@/components/shell/deferred-screens').then(
    (chunk) => (loaded = chunk),
    (error: unknown) => {
      loading = null;
      throw error;
    },
  );
  return loading;
}

/** The response schemas of the first screens (the session, the site list, sign-in's check), from the deferred chunk. */
export function loadFirstScreenSchemas(): Promise<DeferredChunk['firstScreenSchemas']> {
  return loadDeferredChunk().then((chunk) => chunk.firstScreenSchemas);
}
