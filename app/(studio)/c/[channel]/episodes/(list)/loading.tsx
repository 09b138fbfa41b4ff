// Only the episode list streams a skeleton. Pages below /episodes answer 404 or 403 for real, and
// a loading.tsx above them would start a 200 response before their access check (issue 12 item 15).
export { PageSkeleton as default } from '@/components/ui/page-skeleton';
