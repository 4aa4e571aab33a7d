/** The host the renderer talks to: the preload's object in Electron, else the web implementation. */
import { HOST_GLOBAL, type MixwiseHost } from '../../shared/hostApi.ts';
import { createWebHost } from './webHost.ts';

const exposed = (globalThis as unknown as Record<string, MixwiseHost | undefined>)[HOST_GLOBAL];

export const host: MixwiseHost = exposed ?? createWebHost();
