import { lazy, type ComponentType, type LazyExoticComponent } from 'react';

/**
 * React.lazy for a module's named export, so each screen keeps its own chunk and the
 * first page downloads only what it shows.
 */
export function lazyScreen<K extends string, M extends Record<K, ComponentType<any>>>(
  load: () => Promise<M>,
  name: K,
): LazyExoticComponent<M[K]> {
  return lazy(async () => ({ default: (await load())[name] }));
}
