import { useIonToast } from '@ionic/react';
import type { MailJob } from '@plummet/shared';
import { formatDateTime } from '../../../lib/format-date';
import { ManagerLayout } from '../components/ManagerLayout';
import { useRetryMailJobMutation } from '../manager.mutations';
import { useFailedMailJobs } from '../manager.queries';
import './FailedMailPage.css';

const KIND_WORDS: Record<MailJob['kind'], string> = {
  'inspection-report': 'Inspection report',
  'finding-assignment': 'Finding handed to a foreman',
  'daily-digest': 'Daily digest',
};

/**
 * Admins: the organisation's e-mails that the server gave up on after every retry (mail server
 * down for long, an address refused), with what went wrong, and a button to try each once more.
 */
export function FailedMailPage() {
  const jobs = useFailedMailJobs();
  const retry = useRetryMailJobMutation();
  const [presentToast] = useIonToast();

  function sendAgain(job: MailJob) {
    retry.mutate(job.id, {
      onSuccess: () => void presentToast({ message: 'Queued again: it goes out within a minute if the mail server takes it.', duration: 3000, position: 'bottom' }),
      onError: (error) => void presentToast({ message: error instanceof Error ? error.message : 'It could not be queued again.', duration: 4000, position: 'bottom', color: 'danger' }),
    });
  }

  const items = jobs.data ?? [];
  return (
    <ManagerLayout title="E-mails not sent" testId="failed-mail-page">
      <section className="manager-section" aria-labelledby="failed-mail-heading">
        <h2 id="failed-mail-heading">E-mails the server gave up on</h2>
        <p className="failed-mail__intro">
          Each e-mail is tried several times, waiting longer each time. Those below failed every time. Put right what the last error names (the mail server, an
          address), then send again.
        </p>
        {jobs.isError && (
          <p role="alert" data-testid="failed-mail-error">
            The list could not be loaded: {jobs.error instanceof Error ? jobs.error.message : 'try again'}.
          </p>
        )}
        {jobs.isSuccess && items.length === 0 && (
          <p className="failed-mail__none" data-testid="failed-mail-none">
            Nothing is stuck: every e-mail has been sent or is still being tried.
          </p>
        )}
        <ul className="failed-mail__list" data-testid="failed-mail-list">
          {items.map((job) => (
            <li key={job.id} className="failed-mail__item" data-testid="failed-mail-item" data-job-id={job.id}>
              <h3 className="failed-mail__kind">{KIND_WORDS[job.kind]}</h3>
              <p className="failed-mail__subject" data-testid="failed-mail-subject">
                {job.subject ?? 'Its record no longer exists; sending again completes it without an e-mail.'}
              </p>
              <dl className="manager-facts failed-mail__facts">
                <dt>To</dt>
                <dd data-testid="failed-mail-recipients">{job.recipients.length ? job.recipients.join(', ') : 'Nobody at present'}</dd>
                <dt>Last error</dt>
                <dd className="failed-mail__error" data-testid="failed-mail-last-error">{job.error ?? 'Not recorded'}</dd>
                <dt>Tries</dt>
                <dd data-testid="failed-mail-attempts">{job.attempts}</dd>
                <dt>Queued</dt>
                <dd>{formatDateTime(job.createdAt)}</dd>
                <dt>Gave up</dt>
                <dd>{formatDateTime(job.failedAt)}</dd>
              </dl>
              <button
                type="button"
                className="manager-button"
                disabled={retry.isPending && retry.variables === job.id}
                onClick={() => sendAgain(job)}
                data-testid="failed-mail-retry"
              >
                Send again
              </button>
            </li>
          ))}
        </ul>
      </section>
    </ManagerLayout>
  );
}
