export default {
  title: 'Sign in to Lumenyard',
  username: 'User name',
  password: 'Password',
  submit: 'Sign in',
  signingIn: 'Signing in…',
  intro: 'Stock, takeoffs, picking and purchasing for the glass block yard.',
  demoHint: 'Demo sign-ins: admin, counter, warehouse, buyer, viewer',
}
