import Link from "next/link";
import { signOut } from "@/app/(auth)/actions";
import { NotificationLinks } from "@/components/notifications/header-link";
import { getActor } from "@/lib/server/authz";

export async function SiteHeader() {
  const actor = await getActor().catch(() => null);
  return (
    <header className="knit-band border-b border-bark/20 bg-fleece">
      <nav aria-label="Main" className="mx-auto flex max-w-5xl flex-wrap items-center gap-x-5 gap-y-2 px-4 py-3 sm:px-6">
        <Link href="/" className="font-display text-2xl text-madder-dark no-underline">
          Darnwell
        </Link>
        <div className="ml-auto flex flex-wrap items-center gap-4">
          {actor ? (
            <>
              {actor.memberships.length > 0 ? <Link href="/studio">Studio</Link> : null}
              {actor.clientOf.length > 0 || actor.memberships.length === 0 ? <Link href="/portal">My commissions</Link> : null}
              <NotificationLinks actor={actor} />
              <span className="text-bark" data-testid="signed-in-as">
                {actor.name}
              </span>
              <form action={signOut}>
                <button type="submit" className="font-semibold text-madder-dark underline underline-offset-2">
                  Sign out
                </button>
              </form>
            </>
          ) : (
            <>
              <Link href="/sign-in">Sign in</Link>
              <Link href="/sign-up">Create an account</Link>
            </>
          )}
        </div>
      </nav>
    </header>
  );
}

