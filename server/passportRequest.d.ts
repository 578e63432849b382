// passport's request methods (passport 0.7, lib/http/request.js), which its session middleware puts on each request;
// http/session.ts puts them on the app's request prototype once instead.
declare module 'passport/lib/http/request.js' {
  const methods: Record<'logIn' | 'logOut' | 'isAuthenticated' | 'isUnauthenticated', (...args: never[]) => unknown>
  export default methods
}
