/**
 * The most common passwords of leaked password sets, lower-cased: the `passwords-common` list
 * (49,233 entries) of @zxcvbn-ts/language-common, the dictionary of the zxcvbn strength estimator
 * (Wheeler, "zxcvbn: Low-Budget Password Strength Estimation", USENIX Security 2016). Loaded on
 * first use (about 1 MB of module), so that a worker process, which never checks a password, does
 * not pay for it at start.
 */
let common: Promise<Set<string>> | null = null;

/** Starts loading the list (the app calls it at start, so the first sign-up does not wait for it). */
export function loadCommonPasswords(): Promise<Set<string>> {
  common ??= import("@zxcvbn-ts/language-common").then(({ dictionary }) => new Set(dictionary["passwords-common"].map((entry) => entry.toLowerCase())));
  return common;
}

/**
 * True when `password` (compared lower-cased) is on the common-password list: a password any
 * guessing script tries first, whatever its length (NIST SP 800-63B, 5.1.1.2: refuse passwords from
 * lists of commonly used or compromised values).
 */
export async function isCommonPassword(password: string): Promise<boolean> {
  return (await loadCommonPasswords()).has(password.toLowerCase());
}
