import Link from "next/link";

export default function NotFound() {
  return (
    <div className="max-w-prose">
      <h1 className="text-3xl">We could not find that page</h1>
      <p className="mt-3 text-lg text-bark">
        The address may be mistyped, or the page may belong to an account other than the one you are signed in with.
      </p>
      <p className="mt-4">
        <Link href="/">Go to the start page</Link>
      </p>
    </div>
  );
}
