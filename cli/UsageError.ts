/** Bad input at the command line or in a file: exit status 2. */
export class UsageError extends Error {}
