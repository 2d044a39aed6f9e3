import { signOutAction } from '@/app/(lab)/actions';

export function SignOutButton() {
  return (
    <form action={signOutAction}>
      <button type="submit" className="btn">Sign out</button>
    </form>
  );
}
