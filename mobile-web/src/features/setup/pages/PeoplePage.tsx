import { useIonAlert } from '@ionic/react';
import { InvitationCreateSchema, ROLE_VALUES, type Member, type Role } from '@plummet/shared';
import { useMutation } from '@tanstack/react-query';
import { useState, type FormEvent } from 'react';
import { useSession } from '../../auth/session.queries';
import { ManagerLayout } from '../../manager/components/ManagerLayout';
import { describedBy, Field } from '../components/Field';
import { errorFor, fieldErrorsOf, fieldErrorsOfError, type FieldErrors } from '../form-errors';
import { inviteMember, updateMember } from '../setup.api';
import { useOrganisationMembers, useRefreshSetup } from '../setup.queries';
import '../setup.css';

export const ROLE_WORDS: Record<Role, string> = {
  inspector: 'Inspector',
  foreman: 'Foreman',
  manager: 'Manager',
  admin: 'Admin',
};

function StatusPill({ member }: { member: Member }) {
  if (!member.active) return <span className="setup-pill setup-pill--inactive">Deactivated</span>;
  if (member.invitationPending) return <span className="setup-pill setup-pill--pending">Invited, not joined yet</span>;
  return <span className="setup-pill setup-pill--active">Active</span>;
}

/** The organisation's members: invite by e-mail, send an invitation again, change a role, deactivate. */
export function PeoplePage() {
  const members = useOrganisationMembers();
  const me = useSession().session?.user.id;
  const refresh = useRefreshSetup();
  const [presentAlert] = useIonAlert();
  const [note, setNote] = useState<string | null>(null);
  const [rowError, setRowError] = useState<string | null>(null);
  const change = useMutation({
    mutationFn: (input: { member: Member; role?: Role; active?: boolean }) => updateMember(input.member.id, { role: input.role, active: input.active }),
    onSuccess: async (member, input) => {
      setRowError(null);
      setNote(
        input.active === false
          ? `${member.name} is deactivated: signed out everywhere now.`
          : input.active === true
            ? `${member.name} can sign in again.`
            : `${member.name} is now ${ROLE_WORDS[member.role].toLowerCase()}.`,
      );
      await refresh();
    },
    onError: (error) => setRowError(fieldErrorsOfError(error)[''] ?? 'The change was refused.'),
  });
  const resend = useMutation({
    mutationFn: (member: Member) => inviteMember({ email: member.email, name: member.name, role: member.role }),
    onSuccess: async (member) => {
      setRowError(null);
      setNote(`A new invitation link went to ${member.email}; the old link no longer works.`);
      await refresh();
    },
    onError: (error) => setRowError(fieldErrorsOfError(error)[''] ?? 'The invitation could not be sent.'),
  });

  function confirmDeactivate(member: Member) {
    void presentAlert({
      header: `Deactivate ${member.name}?`,
      message: 'They are signed out on every phone and computer at once and cannot sign in again until reactivated. Their records stay.',
      buttons: [
        { text: 'Cancel', role: 'cancel' },
        { text: 'Deactivate', role: 'destructive', handler: () => change.mutate({ member, active: false }) },
      ],
    });
  }

  return (
    <ManagerLayout title="People" testId="people-page" loadedAt={members.dataUpdatedAt} refreshFailed={members.isError}>
      <section className="manager-section">
        <h2>Invite someone</h2>
        <InviteForm onInvited={(m) => setNote(`Invitation sent to ${m.email}.`)} />
      </section>
      {note && (
        <p className="setup-form__saved setup-note" role="status" data-testid="people-note">
          {note}
        </p>
      )}
      {rowError && (
        <p className="setup-form__error setup-note" role="alert">
          {rowError}
        </p>
      )}
      <section className="manager-section">
        <h2>Members</h2>
        {members.isPending && <p>Loading the members…</p>}
        <div className="manager-table-wrap">
          <table className="manager-table setup-people" data-testid="members-table">
            <thead>
              <tr>
                <th scope="col">Name</th>
                <th scope="col">E-mail</th>
                <th scope="col">Role</th>
                <th scope="col">Status</th>
                <th scope="col">
                  <span className="visually-hidden">Actions</span>
                </th>
              </tr>
            </thead>
            <tbody>
              {members.data?.map((member) => (
                <tr key={member.id} data-testid={`member-${member.email}`}>
                  <td>
                    {member.name}
                    {member.position && <div className="setup-muted">{member.position}</div>}
                  </td>
                  <td>{member.email}</td>
                  <td>
                    <select
                      className="setup-people__role"
                      aria-label={`Role of ${member.name}`}
                      value={member.role}
                      disabled={member.id === me || change.isPending}
                      onChange={(e) => change.mutate({ member, role: e.target.value as Role })}
                    >
                      {ROLE_VALUES.map((r) => (
                        <option key={r} value={r}>
                          {ROLE_WORDS[r]}
                        </option>
                      ))}
                    </select>
                  </td>
                  <td>
                    <StatusPill member={member} />
                  </td>
                  <td>
                    <div className="setup-card__actions">
                      {member.id === me && <span className="setup-muted">You (another admin changes your role)</span>}
                      {member.invitationPending && member.active && (
                        <button type="button" className="manager-button manager-button--plain" onClick={() => resend.mutate(member)} disabled={resend.isPending}>
                          Send the invitation again
                        </button>
                      )}
                      {member.id !== me &&
                        (member.active ? (
                          <button type="button" className="manager-button manager-button--plain" onClick={() => confirmDeactivate(member)}>
                            Deactivate…
                          </button>
                        ) : (
                          <button type="button" className="manager-button manager-button--plain" onClick={() => change.mutate({ member, active: true })}>
                            Reactivate
                          </button>
                        ))}
                    </div>
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      </section>
    </ManagerLayout>
  );
}

function InviteForm({ onInvited }: { onInvited(member: Member): void }) {
  const refresh = useRefreshSetup();
  const [form, setForm] = useState({ email: '', name: '', role: 'inspector' as Role });
  const [errors, setErrors] = useState<FieldErrors>({});
  const invite = useMutation({
    mutationFn: inviteMember,
    onSuccess: async (member) => {
      setForm({ email: '', name: '', role: form.role });
      onInvited(member);
      await refresh();
    },
    onError: (error) => setErrors(fieldErrorsOfError(error)),
  });
  function submit(event: FormEvent) {
    event.preventDefault();
    const parsed = InvitationCreateSchema.safeParse(form);
    if (!parsed.success) return setErrors(fieldErrorsOf(parsed.error.issues));
    setErrors({});
    invite.mutate(parsed.data);
  }
  return (
    <form className="setup-form" onSubmit={submit} noValidate data-testid="invite-form">
      <div className="setup-row">
        <Field id="invite-email" label="E-mail" error={errorFor(errors, 'email')}>
          <input {...describedBy('invite-email', errorFor(errors, 'email'))} type="email" autoComplete="off" value={form.email} onChange={(e) => setForm({ ...form, email: e.target.value })} />
        </Field>
        <Field id="invite-name" label="Name" error={errorFor(errors, 'name')}>
          <input {...describedBy('invite-name', errorFor(errors, 'name'))} value={form.name} onChange={(e) => setForm({ ...form, name: e.target.value })} />
        </Field>
        <Field id="invite-role" label="Role" error={errorFor(errors, 'role')}>
          <select {...describedBy('invite-role', errorFor(errors, 'role'))} value={form.role} onChange={(e) => setForm({ ...form, role: e.target.value as Role })}>
            {ROLE_VALUES.map((r) => (
              <option key={r} value={r}>
                {ROLE_WORDS[r]}
              </option>
            ))}
          </select>
        </Field>
      </div>
      {errors[''] && (
        <p className="setup-form__error" role="alert">
          {errors['']}
        </p>
      )}
      <div className="manager-actions">
        <button type="submit" className="manager-button" disabled={invite.isPending} data-testid="send-invitation">
          {invite.isPending ? 'Sending…' : 'Send the invitation'}
        </button>
      </div>
    </form>
  );
}
