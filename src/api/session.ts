// Typed calls for the session (sign-in, sign-out, who is signed in) and the signed-in user's own profile.
// Their answers are checked against the schemas in shared/schemas/auth.ts in development and tests.
import {
  nothingShape, okAnswerSchema, sessionAnswerSchema, signedInAnswerSchema, type ProfileUpdateInput, type SessionAnswer, type SessionUser,
} from '@shared/schemas/auth'
import { api } from './client'

export const sessionApi = {
  /** Who is signed in on this browser (null when nobody), and whether the server runs the demo scenario. */
  current: (): Promise<SessionAnswer> => api.get('/session', { quiet401: true, answer: sessionAnswerSchema }),
  signIn: (username: string, password: string): Promise<{ user: SessionUser }> =>
    api.post('/session', { username, password }, { quiet401: true, answer: signedInAnswerSchema }),
  signOut: (): Promise<void> => api.delete('/session', { quiet401: true, answer: nothingShape }),
  saveProfile: (changes: ProfileUpdateInput): Promise<{ user: SessionUser }> => api.patch('/profile', changes, { answer: signedInAnswerSchema }),
  changePassword: (body: { currentPassword: string; newPassword: string }) => api.post('/profile/password', body, { answer: okAnswerSchema }),
}
