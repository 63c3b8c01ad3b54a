import { dictionary } from "@zxcvbn-ts/language-common";

/**
 * The most common passwords of leaked password sets, lower-cased: the `passwords-common` list
 * (49,233 entries) of @zxcvbn-ts/language-common, the dictionary of the zxcvbn strength estimator
 * (Wheeler, "zxcvbn: Low-Budget Password Strength Estimation", USENIX Security 2016).
 */
let common: Set<string> | null = null;

/**
 * True when `password` (compared lower-cased) is on the common-password list: a password any
 * guessing script tries first, whatever its length (NIST SP 800-63B, 5.1.1.2: refuse passwords from
 * lists of commonly used or compromised values).
 */
export function isCommonPassword(password: string): boolean {
  common ??= new Set(dictionary["passwords-common"].map((entry) => entry.toLowerCase()));
  return common.has(password.toLowerCase());
}
