import bcrypt from 'bcryptjs';

/** bcrypt cost 12: about a quarter second per check on this machine class (OWASP suggests 10 or more). */
const cost = 12;

export const hashPassword = (password: string): Promise<string> => bcrypt.hash(password, cost);

// Checked when the e-mail is unknown, so a wrong address costs as long as a wrong password.
const decoyHash = bcrypt.hashSync('halflight-decoy-password', cost);

export async function verifyPassword(password: string, hash: string | null | undefined): Promise<boolean> {
  const matches = await bcrypt.compare(password, hash ?? decoyHash);
  return hash ? matches : false;
}
