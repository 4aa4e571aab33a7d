/**
 * The program version (package.json), printed on reports and part of the scenario fingerprint.
 * Vite keeps only this one field of package.json in the bundle (named JSON import).
 */
import { version } from '../../../package.json';

export const APP_VERSION: string = version;
