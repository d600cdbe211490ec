// Types of no-node-apis.mjs (the esbuild plugin the browser builds use), for the test that checks it.
import type { Plugin } from 'esbuild';
export declare const noNodeApis: Plugin;
