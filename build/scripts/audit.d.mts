/** Types of `audit.mjs` for its test. */
export declare const FAILING: string[];
export declare function judgeAudit(jsonText: string): { ok: boolean; ran: boolean; message: string };
