/** passport's request functions (req.logIn, req.logOut, …), which its authenticate puts on each request. */
declare module 'passport/lib/http/request.js' {
  import type { Request } from 'express';

  const request: Pick<Request, 'logIn' | 'logOut' | 'isAuthenticated' | 'isUnauthenticated'>;
  export default request;
}
