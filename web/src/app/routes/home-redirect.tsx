import { Navigate } from 'react-router-dom';
import { useSignedInUser } from '@/lib/signed-in-user';
import { firstPathFor } from '../navigation';

/** "/" has no page of its own: it opens the first page of the person's role. */
export function HomeRedirect() {
  const me = useSignedInUser();
  return <Navigate to={firstPathFor(me.role)} replace />;
}
