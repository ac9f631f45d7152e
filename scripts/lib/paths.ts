import path from 'node:path';
import { fileURLToPath } from 'node:url';

export const projectRoot = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
/** npm start's own state (database, secret); ignored by git, never touched by the tests. */
export const dataDir = path.join(projectRoot, '.data');
export const webDist = path.join(projectRoot, 'dist', 'web');
export const bin = (name: string): string => path.join(projectRoot, 'node_modules', '.bin', name);
