import NextAuth, { CredentialsSignin, type NextAuthConfig } from 'next-auth';
import Credentials from 'next-auth/providers/credentials';
import Nodemailer from 'next-auth/providers/nodemailer';
import { DrizzleAdapter } from '@auth/drizzle-adapter';
import { eq } from 'drizzle-orm';
import { db, getDb } from '@/db/client';
import { accounts, sessions, users, verificationTokens } from '@/db/schema';
import { env } from '@/lib/env';
import { mailTransport } from '@/lib/mail/transport';
import { signInLinkMessage } from '@/lib/mail/templates';
import { verifyPassword } from './password';
import { checkSignIn, clientAddress, recordSignInFailure } from './rate-limit';
import { acceptInvitation } from './invitations';
import { passwordSignInSchema } from './schemas';

class TooManyAttempts extends CredentialsSignin {
  code = 'rate_limited';
}
class InvitationInvalid extends CredentialsSignin {
  code = 'invitation_invalid';
}

function config(): NextAuthConfig {
  const e = env();
  return {
    secret: e.AUTH_SECRET,
    trustHost: true,
    adapter: DrizzleAdapter(getDb(), {
      usersTable: users,
      accountsTable: accounts,
      sessionsTable: sessions,
      verificationTokensTable: verificationTokens,
    }),
    // Credentials sign-in only works with JWT sessions; e-mail links use the same.
    session: { strategy: 'jwt', maxAge: 12 * 60 * 60 },
    pages: { signIn: '/signin', verifyRequest: '/signin/check-email', error: '/signin' },
    providers: [
      Credentials({
        id: 'password',
        name: 'Password',
        credentials: { email: {}, password: {} },
        async authorize(raw, request) {
          const parsed = passwordSignInSchema.safeParse(raw);
          if (!parsed.success) return null;
          const { email, password } = parsed.data;
          const address = clientAddress(request.headers);
          const limit = await checkSignIn(email, address);
          if (!limit.allowed) throw new TooManyAttempts();
          const [user] = await db.select().from(users).where(eq(users.email, email)).limit(1);
          const ok = await verifyPassword(password, user?.passwordHash);
          if (!user || !ok) {
            await recordSignInFailure(email, address);
            return null;
          }
          return { id: user.id, email: user.email, name: user.name };
        },
      }),
      Credentials({
        id: 'invitation',
        name: 'Invitation',
        credentials: { token: {}, name: {} },
        async authorize(raw) {
          const token = typeof raw?.token === 'string' ? raw.token : '';
          const name = typeof raw?.name === 'string' ? raw.name.trim().slice(0, 120) : '';
          const user = await acceptInvitation({ token, name });
          if (!user) throw new InvitationInvalid();
          return user;
        },
      }),
      Nodemailer({
        id: 'email',
        server: {},
        from: e.MAIL_FROM,
        async sendVerificationRequest({ identifier, url }) {
          const msg = signInLinkMessage(url);
          await mailTransport().sendMail({ from: e.MAIL_FROM, to: identifier, ...msg });
        },
      }),
    ],
    callbacks: {
      async signIn({ user, account }) {
        // E-mail links are for people who already have an account (members or invitees);
        // nobody creates an account by typing an address.
        if (account?.provider === 'email') {
          const email = user.email?.toLowerCase();
          if (!email) return false;
          const [existing] = await db.select({ id: users.id }).from(users).where(eq(users.email, email)).limit(1);
          return Boolean(existing);
        }
        return true;
      },
      async jwt({ token, user }) {
        if (user?.id) token.sub = user.id;
        return token;
      },
      async session({ session, token, user }) {
        const id = token?.sub ?? user?.id;
        if (id && session.user) session.user.id = id;
        return session;
      },
    },
  };
}

export const { handlers, auth, signIn, signOut } = NextAuth(() => config());
