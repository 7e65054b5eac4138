/** Types of `ensure-chromium.mjs` for the TypeScript e2e set-up. */
export declare const CHROMIUM_PATH: string;
export declare const INSTALL_COMMAND: string;
export declare function ensureChromium(): void;
