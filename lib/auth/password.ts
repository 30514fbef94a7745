import bcrypt from "bcryptjs";

const COST = 11;

export function hashPassword(plain: string): Promise<string> {
  return bcrypt.hash(plain, COST);
}

let dummyHash: string | undefined;

export function verifyPassword(plain: string, hash: string | null | undefined): Promise<boolean> {
  // Compare against a throw-away hash when the user has none, so timing does not reveal which accounts exist.
  dummyHash ??= bcrypt.hashSync("loopledger-no-such-account", COST);
  return bcrypt.compare(plain, hash ?? dummyHash).then((ok) => ok && Boolean(hash));
}

/** Password policy: 12+ characters, not the e-mail or its local part, not a single repeated character. */
export function passwordProblems(password: string, email: string): string[] {
  const problems: string[] = [];
  const lower = password.toLowerCase();
  const mail = email.trim().toLowerCase();
  if (password.length < 12) problems.push("Use at least 12 characters.");
  if (password.length > 200) problems.push("Use at most 200 characters.");
  if (mail && (lower === mail || lower === mail.split("@")[0] || lower.includes(mail))) {
    problems.push("Do not use your e-mail address as the password.");
  }
  if (/^(.)\1*$/.test(password)) problems.push("Do not repeat a single character.");
  return problems;
}
