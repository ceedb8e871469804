import { PageSkeleton, SkeletonBlock } from "@/components/ui/skeleton";

// Shown while the proof, its chart pictures and comments load.
export default function Loading() {
  return (
    <PageSkeleton label="Loading the proof…">
      <SkeletonBlock className="h-72 w-full" />
      <SkeletonBlock className="h-20 w-full" />
      <SkeletonBlock className="h-20 w-3/4" />
    </PageSkeleton>
  );
}
