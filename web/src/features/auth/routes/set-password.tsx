import { Link, Stack, Text } from '@chakra-ui/react';
import { useEffect, useState } from 'react';
import { Link as RouterLink, useLocation, useNavigate } from 'react-router-dom';
import { ErrorAlert } from '@/components/ui/error-alert';
import { Loading } from '@/components/ui/loading';
import { useAccountLink } from '../api/account-links';
import { AuthCard } from '../components/auth-card';
import { SetPasswordForm } from '../components/set-password-form';

const WHY: Record<'used' | 'expired' | 'replaced' | 'unknown', string> = {
  used: 'This link has been used already: each link works once.',
  expired: 'This link has expired.',
  replaced: 'A newer link was sent since this one: open the newest mail.',
  unknown: 'This link is not known. Open it from the mail again, with its whole address.',
};

/** Chooses a password with the link of an invitation or a password reset mail. */
export function SetPasswordRoute() {
  const location = useLocation();
  const navigate = useNavigate();
  // The token is in the link's fragment (#token=…), which never reaches a server or its log.
  // It is read once, then taken out of the address bar and the history.
  const [token] = useState(() => new URLSearchParams(location.hash.slice(1)).get('token'));
  const link = useAccountLink(token);
  const [done, setDone] = useState<string | null>(null);

  useEffect(() => {
    document.title = 'Choose your password · Crumbproof';
  }, []);

  useEffect(() => {
    if (location.hash) void navigate(location.pathname, { replace: true });
  }, [location.hash, location.pathname, navigate]);

  const askAgain = (
    <Text>
      <Link asChild fontWeight="bold">
        <RouterLink to="/forgot-password">Send me a new link</RouterLink>
      </Link>{' '}
      (if you were invited and have not chosen a password yet, ask your manager to send the invitation again).
    </Text>
  );

  let body;
  if (done) {
    body = (
      <Stack gap="4" role="status">
        <Text>Your password is set. Sign in with {done} and the password you chose; any other session of yours was signed out.</Text>
        <Link asChild fontWeight="bold">
          <RouterLink to="/sign-in">Sign in</RouterLink>
        </Link>
      </Stack>
    );
  } else if (!token) {
    body = (
      <Stack gap="4">
        <ErrorAlert>Open the link in the mail you were sent, with its whole address.</ErrorAlert>
        {askAgain}
      </Stack>
    );
  } else if (link.isPending) {
    body = <Loading>Checking the link…</Loading>;
  } else if (link.isError) {
    body = <ErrorAlert>The link could not be checked: {link.error.message}</ErrorAlert>;
  } else if (link.data.state !== 'usable') {
    body = (
      <Stack gap="4">
        <ErrorAlert title="This link cannot be used">{WHY[link.data.state]}</ErrorAlert>
        {askAgain}
      </Stack>
    );
  } else {
    const invitation = link.data.purpose === 'invitation';
    body = (
      <Stack gap="5">
        <Text>
          {invitation ? 'Welcome' : 'Hello'}, {link.data.name}. Your account is {link.data.email}.
        </Text>
        <SetPasswordForm
          token={token}
          email={link.data.email}
          submitLabel={invitation ? 'Set my password' : 'Set my new password'}
          onSet={setDone}
        />
      </Stack>
    );
  }

  return (
    <AuthCard title="Choose your password" lead="The link in your mail works once. Choosing a password signs you out everywhere else.">
      {body}
    </AuthCard>
  );
}
