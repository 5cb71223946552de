import { redirect } from 'react-router-dom';
import type { LoaderFunctionArgs } from 'react-router-dom';
import { getSessionQueryOptions } from '@/features/auth/api/get-session';
import { queryClient } from '@/lib/query-client';
import { paths } from '@/lib/paths';

/** Guards the signed-in area: loads the current person once, else sends them to sign in and back. */
export async function requireSessionLoader({ request }: LoaderFunctionArgs) {
  const session = await queryClient.ensureQueryData(getSessionQueryOptions());
  if (!session) {
    const url = new URL(request.url);
    throw redirect(paths.signIn(url.pathname + url.search));
  }
  return null;
}

/** Public screens load the session too: it fetches the CSRF token their forms will send. */
export async function bootstrapSessionLoader() {
  await queryClient.ensureQueryData(getSessionQueryOptions());
  return null;
}

/** Only addresses inside this app may be a return address; anything else goes to the overview. */
export function safeReturnAddress(next: string | null): string {
  return next && next.startsWith('/') && !next.startsWith('//') && !next.startsWith('/\\') ? next : '/';
}
