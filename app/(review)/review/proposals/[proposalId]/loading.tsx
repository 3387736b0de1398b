import { PageSkeleton } from "@/components/ui/page-skeleton";

// Below the segment's layout, which has already answered 404 for a proposal not sent to the
// reviewer's account: a loading boundary above it would stream that 404 with status 200.
export default function Loading() {
  return <PageSkeleton />;
}
