import { NotFoundView } from '@/components/shell/not-found-view';

// Inside the shell: a group the visitor is not in looks exactly like one that does not exist.
export default function BoardNotFound() {
  return <NotFoundView />;
}
