import { PageSkeleton, SkeletonBlock } from "@/components/ui/skeleton";

// Shown while the schedule is planned (every piece placed on the team's working days).
export default function Loading() {
  return (
    <PageSkeleton label="Planning the schedule…">
      <SkeletonBlock className="h-64 w-full" />
      <SkeletonBlock className="h-24 w-full" />
    </PageSkeleton>
  );
}
