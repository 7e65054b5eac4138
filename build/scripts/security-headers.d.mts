/** Types of `security-headers.mjs` for the TypeScript e2e set-up and tests. */
export declare const PREVIEW_CSP: string;
export declare const PREVIEW_HEADERS: Record<string, string>;
export declare function parsePort(args: string[], fallback?: number): { port: number } | { error: string };
