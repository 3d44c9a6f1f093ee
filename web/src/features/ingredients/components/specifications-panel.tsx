import { Box, Button, Link, Progress, Stack, Text } from '@chakra-ui/react';
import { useRef, useState, type FormEvent } from 'react';
import { ErrorAlert } from '@/components/ui/error-alert';
import { FormField, TextInput } from '@/components/ui/form-field';
import { Loading } from '@/components/ui/loading';
import { Panel } from '@/components/ui/panel';
import { isApiError } from '@/lib/api-client';
import { withKitchen } from '@/lib/kitchen-choice';
import { useSpecifications } from '../api/get-specifications';
import { SPECIFICATION_MAX_BYTES, useUploadSpecification } from '../api/upload-specification';
import { formatDate, formatDateTime } from '@/lib/format';
import { formatBytes } from '../utils/ingredient-facts';

const ACCEPT = 'application/pdf,image/png,image/jpeg,image/webp,.pdf,.png,.jpg,.jpeg,.webp';

function todayIso(now = new Date()): string {
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${now.getFullYear()}-${pad(now.getMonth() + 1)}-${pad(now.getDate())}`;
}

function uploadMessage(error: unknown): string {
  if (!isApiError(error)) return 'The specification was not uploaded. Try again in a moment.';
  if (error.status === 413)
    return 'The file is larger than 10 MB. Save a smaller copy (for example, fewer pages or a lower-resolution scan) and upload that.';
  const details = error.fields.map((field) => field.message).filter((message) => !error.message.includes(message));
  return [error.message, ...details].join(' ');
}

/** Versions of the supplier's specification, newest first, and a form to attach a new one. */
export function SpecificationsPanel({ code }: { code: string }) {
  const specifications = useSpecifications(code);
  const upload = useUploadSpecification();
  const fileRef = useRef<HTMLInputElement>(null);
  const [reviewBy, setReviewBy] = useState('');
  const [note, setNote] = useState('');
  const [problems, setProblems] = useState<{ file?: string; reviewBy?: string; form?: string }>({});
  const [done, setDone] = useState<string | null>(null);
  const current = specifications.data?.[0];

  function handleUpload(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    setDone(null);
    const file = fileRef.current?.files?.[0];
    const found: typeof problems = {};
    if (!file) found.file = 'Choose the specification file: a PDF or an image (PNG, JPEG or WebP).';
    else if (file.size > SPECIFICATION_MAX_BYTES)
      found.file = `This file is ${formatBytes(file.size)}; the limit is 10 MB. Save a smaller copy and upload that.`;
    if (reviewBy !== '' && reviewBy < todayIso())
      found.reviewBy = `${formatDate(reviewBy)} has already passed; give today or a later date.`;
    setProblems(found);
    if (!file || Object.keys(found).length > 0) return;

    upload.mutate(
      { code, file, reviewBy, note },
      {
        onSuccess: (spec) => {
          setDone(`Version ${spec.version} (${spec.filename}) uploaded. Review by ${formatDate(spec.reviewBy)}.`);
          setNote('');
          setReviewBy('');
          if (fileRef.current) fileRef.current.value = '';
        },
        onError: (error) => {
          const message = uploadMessage(error);
          const onField = isApiError(error) ? error.fields : [];
          setProblems({
            file:
              onField.find((field) => field.path === 'file')?.message ?? (isApiError(error) && error.status === 413 ? message : undefined),
            reviewBy: onField.find((field) => field.path === 'reviewBy')?.message,
            form: message,
          });
        },
      },
    );
  }

  return (
    <Panel title="Specifications" size="md">
      <Stack gap="4">
        {specifications.isPending ? (
          <Loading size="sm">Loading specifications…</Loading>
        ) : specifications.isError ? (
          <Text color="fg.error">The specifications could not be loaded: {specifications.error.message}</Text>
        ) : current ? (
          <Box>
            <Link href={withKitchen(current.fileUrl)} target="_blank" rel="noopener" color="accent.fg" fontWeight="bold">
              Open the current specification
            </Link>
            <Text textStyle="sm" color={current.reviewOverdue ? 'fg' : 'fg.muted'} fontWeight={current.reviewOverdue ? 'bold' : 'normal'}>
              Version {current.version}, {current.reviewOverdue ? 'review overdue since' : 'review by'} {formatDate(current.reviewBy)}
            </Text>
          </Box>
        ) : (
          <Text fontWeight="bold">No specification attached yet.</Text>
        )}

        <form aria-label="Upload a specification" noValidate onSubmit={handleUpload}>
          <Stack gap="3">
            {problems.form ? <ErrorAlert title="The specification was not uploaded">{problems.form}</ErrorAlert> : null}
            <FormField label="Specification file" hint="PDF, PNG, JPEG or WebP, up to 10 MB." error={problems.file}>
              <TextInput ref={fileRef} type="file" accept={ACCEPT} size="md" p="1.5" disabled={upload.isPending} />
            </FormField>
            <FormField label="Review by" hint="Left empty: one year from today." error={problems.reviewBy}>
              <TextInput
                type="date"
                min={todayIso()}
                value={reviewBy}
                size="md"
                disabled={upload.isPending}
                onChange={(event) => setReviewBy(event.currentTarget.value)}
              />
            </FormField>
            <FormField label="Note (optional)">
              <TextInput
                value={note}
                maxLength={500}
                size="md"
                disabled={upload.isPending}
                onChange={(event) => setNote(event.currentTarget.value)}
              />
            </FormField>
            <Button type="submit" size="md" alignSelf="flex-start" loading={upload.isPending} loadingText="Uploading…">
              Upload specification
            </Button>
            {upload.isPending ? (
              <Progress.Root value={null} size="sm" aria-label="Uploading specification">
                <Progress.Track bg="bg.muted">
                  <Progress.Range bg="accent.solid" />
                </Progress.Track>
                <Progress.Label textStyle="sm" color="fg.muted" mt="1">
                  Uploading specification…
                </Progress.Label>
              </Progress.Root>
            ) : null}
            <Text role="status" textStyle="sm">
              {done}
            </Text>
          </Stack>
        </form>

        {specifications.data && specifications.data.length > 0 ? (
          <Box>
            <Text fontWeight="bold" mb="1">
              All versions, newest first
            </Text>
            <Stack as="ol" aria-label="Specification versions, newest first" gap="2" listStyleType="none" m="0" p="0">
              {specifications.data.map((spec) => (
                <Box as="li" key={spec.id} textStyle="sm">
                  <Link href={withKitchen(spec.fileUrl)} target="_blank" rel="noopener" color="accent.fg">
                    Version {spec.version}: {spec.filename}
                  </Link>
                  <Text color="fg.muted">
                    {formatBytes(spec.sizeBytes)} · uploaded {formatDateTime(spec.uploadedAt)} · review by {formatDate(spec.reviewBy)}
                    {spec.reviewOverdue ? ' (overdue)' : ''}
                  </Text>
                  {spec.note ? <Text>{spec.note}</Text> : null}
                </Box>
              ))}
            </Stack>
          </Box>
        ) : null}
      </Stack>
    </Panel>
  );
}
