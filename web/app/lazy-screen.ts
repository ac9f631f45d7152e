import { lazy, type ComponentType, type LazyExoticComponent } from 'react';

/** The names of a module's exports that are components. */
type ComponentName<M> = { [K in keyof M]: M[K] extends ComponentType<never> ? K : never }[keyof M];

/** The component a module exports as `K`, with its own props. */
type ComponentOf<M, K extends keyof M> = M[K] extends ComponentType<infer P> ? ComponentType<P> : never;

/**
 * React.lazy for a module's named export, so each screen keeps its own chunk and the
 * first page downloads only what it shows.
 */
export function lazyScreen<M, K extends ComponentName<M>>(
  load: () => Promise<M>,
  name: K,
): LazyExoticComponent<ComponentOf<M, K>> {
  // The assertion only restates M[K]: `name` is one of the module's components.
  return lazy(async () => ({ default: (await load())[name] as ComponentOf<M, K> }));
}
