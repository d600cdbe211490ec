/** The version, from package.json (bundled into each build: the one place it is written). */
import { version } from '../../../package.json';

export const VERSION: string = version;
