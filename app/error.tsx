"use client";
import { Button } from "@/components/ui/button";

export default function ErrorPage({ reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return (
    <div className="max-w-prose" role="alert">
      <h1 className="text-3xl">Something went wrong</h1>
      <p className="mt-3 text-lg text-bark">
        The problem was on our side and nothing you typed has been lost from the page. Try again; if it keeps happening,
        tell your studio.
      </p>
      <div className="mt-4">
        <Button onClick={() => reset()}>Try again</Button>
      </div>
    </div>
  );
}
