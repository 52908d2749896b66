import { useQuasar } from 'quasar'
import { ROLE_LABELS, ROLES, type Role } from '../../api/auth'
import { isApiError } from '../../api/http'
import { usersApi, type UserPatch, type UserRecord } from '../../api/users'

/** Role change and (de)activation, each behind a confirmation; `onSaved` receives the updated row. */
export function useUserActions(onSaved: (user: UserRecord) => void) {
  const $q = useQuasar()

  async function save(user: UserRecord, patch: UserPatch, done: string): Promise<void> {
    try {
      const { user: updated } = await usersApi.update(user.id, patch)
      onSaved(updated)
      $q.notify({ type: 'positive', message: done })
    } catch (err) {
      const message = isApiError(err, 'cannot_demote_self')
        ? 'You cannot deactivate yourself or remove your own admin role. Ask another administrator.'
        : isApiError(err)
          ? err.message
          : 'The change was not saved. Try again.'
      $q.notify({ type: 'negative', message })
    }
  }

  function changeRole(user: UserRecord): void {
    $q.dialog({
      title: `Change role for ${user.name}`,
      message: 'The role decides which pages they see and what they may change.',
      options: {
        type: 'radio',
        model: user.role,
        items: ROLES.map((value) => ({ value, label: ROLE_LABELS[value] })),
      },
      cancel: { flat: true, noCaps: true, label: 'Cancel' },
      ok: { color: 'primary', unelevated: true, noCaps: true, label: 'Change role' },
      persistent: true,
    }).onOk((role: Role) => {
      if (role !== user.role) void save(user, { role }, `${user.name} is now ${ROLE_LABELS[role]}.`)
    })
  }

  function toggleActive(user: UserRecord): void {
    const deactivate = user.active
    $q.dialog({
      title: deactivate ? `Deactivate ${user.name}?` : `Reactivate ${user.name}?`,
      message: deactivate
        ? 'They can no longer sign in. Everything they recorded stays in the log.'
        : 'They can sign in again with their existing password.',
      cancel: { flat: true, noCaps: true, label: 'Cancel' },
      ok: {
        color: deactivate ? 'negative' : 'primary',
        unelevated: true,
        noCaps: true,
        label: deactivate ? 'Deactivate' : 'Reactivate',
      },
      persistent: true,
    }).onOk(() => {
      void save(
        user,
        { active: !deactivate },
        deactivate ? `${user.name} is deactivated.` : `${user.name} is active again.`,
      )
    })
  }

  function resendInvite(user: UserRecord): void {
    $q.dialog({
      title: `Send the invitation to ${user.name} again?`,
      message: `A new link goes to ${user.email}. The link in the earlier invitation stops working.`,
      cancel: { flat: true, noCaps: true, label: 'Cancel' },
      ok: { color: 'primary', unelevated: true, noCaps: true, label: 'Send again' },
      persistent: true,
    }).onOk(async () => {
      try {
        onSaved((await usersApi.resendInvite(user.id)).user)
        $q.notify({ type: 'positive', message: `A new invitation is on its way to ${user.email}.` })
      } catch (err) {
        $q.notify({ type: 'negative', message: isApiError(err) ? err.message : 'Not sent. Try again.' })
      }
    })
  }

  return { changeRole, toggleActive, resendInvite }
}
