import { PageSkeleton, SkeletonBlock } from "@/components/ui/skeleton";

// Shown while the studio's hours and estimates are added up.
export default function Loading() {
  return (
    <PageSkeleton label="Adding up the hours…">
      <div className="grid gap-4 md:grid-cols-2">
        <SkeletonBlock className="h-56 w-full" />
        <SkeletonBlock className="h-56 w-full" />
      </div>
      <SkeletonBlock className="h-32 w-full" />
    </PageSkeleton>
  );
}
