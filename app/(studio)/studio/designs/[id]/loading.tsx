import { PageSkeleton, SkeletonBlock } from "@/components/ui/skeleton";

// Shown while the design, its sizing and the studio's yarns load (the editor takes a second or two).
export default function Loading() {
  return (
    <PageSkeleton label="Opening the chart editor…">
      <div className="grid gap-6 lg:grid-cols-[1fr_20rem]">
        <div className="space-y-3">
          <SkeletonBlock className="h-9 w-full" />
          <SkeletonBlock className="h-[50vh] w-full" />
        </div>
        <div className="space-y-3">
          <SkeletonBlock className="h-48 w-full" />
          <SkeletonBlock className="h-32 w-full" />
        </div>
      </div>
    </PageSkeleton>
  );
}
