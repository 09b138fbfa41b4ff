import { NotAllowed } from '@/components/shell/not-allowed';

// Rendered inside the channel layout, so a refused page keeps the shell and its navigation.
export default function Forbidden() {
  return <NotAllowed />;
}
