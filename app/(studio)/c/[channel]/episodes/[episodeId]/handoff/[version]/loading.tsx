export { PageSkeleton as default } from '@/components/ui/page-skeleton';
