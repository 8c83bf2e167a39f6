/** Security: headers, CSP, write rate limits, token redaction in logs. */
export * from './security-plugin';
export * from './content-security-policy';
export * from './redact-tokens';
export * from './host-allow-list';
export * from './connection-limits';
