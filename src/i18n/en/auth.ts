export default {
  title: 'Sign in to Lumenyard',
  username: 'User name',
  password: 'Password',
  submit: 'Sign in',
  signingIn: 'Signing in…',
  intro: 'Stock, takeoffs, picking and purchasing for the glass block yard.',
  demoHint: 'Demo scenario: sign in as admin, counter, warehouse, buyer or viewer with the password brightcourse-demo.',
}
