import { Alert } from '@chakra-ui/react';
import type { ReactNode } from 'react';

interface ErrorAlertProps {
  title?: string;
  children: ReactNode;
}

/** A problem the person should read now: announced by screen readers as it appears. */
export function ErrorAlert({ title, children }: ErrorAlertProps) {
  return (
    <Alert.Root role="alert" status="error" bg="bg.error" color="fg" borderWidth="1px" borderColor="border.error" borderStartWidth="4px">
      <Alert.Indicator color="fg.error" />
      <Alert.Content>
        {title ? <Alert.Title fontWeight="bold">{title}</Alert.Title> : null}
        <Alert.Description>{children}</Alert.Description>
      </Alert.Content>
    </Alert.Root>
  );
}
