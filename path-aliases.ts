// The three top-level folders by name, so an import says which side it reaches into
// instead of climbing `../../..`. tsconfig.json's `paths` says the same for the type
// checker, tsx and the linter; Vite and Vitest read this map.
import { fileURLToPath } from 'node:url';

const folder = (name: string) => fileURLToPath(new URL(`./${name}`, import.meta.url));

export const pathAliases = {
  '@shared': folder('shared'),
  '@api': folder('api'),
  '@web': folder('web'),
};
