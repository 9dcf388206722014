/** The sign-out warning: what would be lost, in plain numbers. */
export function signOutWarning(waiting: number): { header: string; message: string; confirm: string } {
  if (waiting === 0) {
    return {
      header: 'Sign out?',
      message: 'Every change has been sent. Signing out removes the sites, findings and photos kept on this phone; download them again next time.',
      confirm: 'Sign out',
    };
  }
  return {
    header: `${waiting} change${waiting === 1 ? '' : 's'} not sent`,
    message: `${waiting} change${waiting === 1 ? ' has' : 's have'} not reached the server yet. Signing out now deletes ${waiting === 1 ? 'it' : 'them'} from this phone, photos included, for good. Connect and let them send first unless you are sure.`,
    confirm: 'Delete them and sign out',
  };
}
