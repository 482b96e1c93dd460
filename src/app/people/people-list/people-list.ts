import { DOCUMENT } from '@angular/common';
import {
  ChangeDetectionStrategy,
  Component,
  OnInit,
  computed,
  inject,
  signal,
} from '@angular/core';
import { MatButton, MatIconButton } from '@angular/material/button';
import { MatDialog, MatDialogConfig } from '@angular/material/dialog';
import { MatIcon } from '@angular/material/icon';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatSnackBar } from '@angular/material/snack-bar';
import {
  MatCell,
  MatCellDef,
  MatColumnDef,
  MatHeaderCell,
  MatHeaderCellDef,
  MatHeaderRow,
  MatHeaderRowDef,
  MatRow,
  MatRowDef,
  MatTable,
} from '@angular/material/table';
import { MatTooltip } from '@angular/material/tooltip';
import { Router } from '@angular/router';
import { Person } from '../../core/api/api-types';
import { messageOf } from '../../core/api/message-of';
import { PHONE_WIDTH, mediaMatch } from '../../ui/media-match';
import { SessionStore } from '../../core/auth/session-store';
import {
  InvitationLinkDialog,
  InvitationLinkDialogData,
} from '../invitation-link-dialog/invitation-link-dialog';
import { PasswordResetDialog } from '../password-reset-dialog/password-reset-dialog';
import { AddedPerson, PeopleStore } from '../people-store';
import { PersonAddDialog } from '../person-add-dialog/person-add-dialog';
import { PersonEditDialog } from '../person-edit-dialog/person-edit-dialog';
import { PersonStatusDialog } from '../person-status-dialog/person-status-dialog';
import { roleLabel } from '../role-options';
import { adminEverywhere, rolesInWords } from '../site-roles';

const FORM_DIALOG: MatDialogConfig = { width: '520px', maxWidth: '95vw' };
const CONFIRM_DIALOG: MatDialogConfig = { width: '480px', maxWidth: '95vw', role: 'alertdialog' };

/** Everyone who can sign in, with their role and status, and what an admin can do about them. */
@Component({
  selector: 'app-people-list',
  imports: [
    MatTable,
    MatColumnDef,
    MatHeaderCellDef,
    MatHeaderCell,
    MatCellDef,
    MatCell,
    MatHeaderRowDef,
    MatHeaderRow,
    MatRowDef,
    MatRow,
    MatButton,
    MatIconButton,
    MatIcon,
    MatTooltip,
    MatProgressBar,
  ],
  templateUrl: './people-list.html',
  styleUrls: ['../people-tab.css', './people-list.css'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class PeopleList implements OnInit {
  private readonly store = inject(PeopleStore);
  private readonly session = inject(SessionStore);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  private readonly router = inject(Router);
  private readonly document = inject(DOCUMENT);

  protected readonly people = this.store.people;
  protected readonly loading = this.store.loading;
  protected readonly loaded = this.store.loaded;
  protected readonly failure = this.store.failure;
  protected readonly meId = computed(() => this.session.person()?.id ?? null);
  /** A phone: the name column carries username, role and status, and the actions come next. */
  protected readonly narrow = mediaMatch(PHONE_WIDTH);
  protected readonly columns = computed(() =>
    this.narrow()
      ? ['name', 'actions']
      : ['name', 'username', 'role', 'email', 'status', 'actions'],
  );
  /** A person's role in words; on an install of several sites, with the site of each role. */
  protected readonly roleText = computed(() => {
    // The group's sites (an admin of the group sees them all); none on a single kitchen.
    const sites = this.session.sites();
    return (person: Person) =>
      sites.length > 0 ? rolesInWords(person, sites) : roleLabel(person.role);
  });
  /** The id of the person whose invitation is being sent again, or null. */
  protected readonly resending = signal<number | null>(null);
  /** "5 people: 4 active, 1 inactive". */
  protected readonly summary = computed(() => {
    const people = this.people();
    const inactive = people.filter((person) => !person.active).length;
    const total = `${people.length} ${people.length === 1 ? 'person' : 'people'}`;
    return inactive === 0
      ? total
      : `${total}: ${people.length - inactive} active, ${inactive} inactive`;
  });

  ngOnInit(): void {
    void this.store.load();
  }

  protected reload(): void {
    void this.store.load();
  }

  protected addPerson(): void {
    this.dialog
      .open<PersonAddDialog, void, AddedPerson>(PersonAddDialog, FORM_DIALOG)
      .afterClosed()
      .subscribe((added) => {
        if (!added) return;
        const { person, invitation } = added;
        // "cook", or "cook at Saltmarrow Quay shop only".
        const words = this.roleText()(person);
        const role = words.charAt(0).toLowerCase() + words.slice(1);
        this.tell(
          invitation?.link
            ? `${person.displayName} is added as ${role}; pass them the invitation link you copied.`
            : invitation
              ? `${person.displayName} is added as ${role}; an invitation to set their password went to ${invitation.sentTo}.`
              : `${person.displayName} is added as ${role}.`,
        );
      });
  }

  protected editPerson(person: Person): void {
    this.dialog
      .open<PersonEditDialog, Person, Person>(PersonEditDialog, { ...FORM_DIALOG, data: person })
      .afterClosed()
      .subscribe((changed) => {
        if (!changed) return;
        if (changed.id === this.meId() && !adminEverywhere(changed)) {
          // The session still says admin; a fresh page load asks the server who we are now.
          this.document.location.assign('/batches');
          return;
        }
        // Our own role at a site may have changed: the site picker shows the new one.
        if (changed.id === this.meId()) void this.session.loadSites();
        this.tell(`Changes to ${changed.displayName} are saved.`);
      });
  }

  protected switchActive(person: Person): void {
    this.dialog
      .open<PersonStatusDialog, Person, Person>(PersonStatusDialog, {
        ...CONFIRM_DIALOG,
        data: person,
      })
      .afterClosed()
      .subscribe((changed) => {
        if (!changed) return;
        if (changed.id === this.meId() && !changed.active) {
          // The server has ended our own session with the change.
          this.session.forget();
          void this.router.navigate(['/sign-in']);
          return;
        }
        this.tell(
          changed.active
            ? `${changed.displayName} is active again and can sign in.`
            : `${changed.displayName} is deactivated; their session has ended.`,
        );
      });
  }

  /**
   * Sends a new invitation; the link of the one before stops working. With no mail server its
   * link is shown once, in a dialog only its button closes.
   */
  protected async resendInvitation(person: Person): Promise<void> {
    if (this.resending() !== null) return;
    this.resending.set(person.id);
    try {
      const invitation = await this.store.resendInvitation(person.id);
      const link = invitation.link;
      if (link) {
        this.dialog.open<InvitationLinkDialog, InvitationLinkDialogData>(InvitationLinkDialog, {
          ...FORM_DIALOG,
          disableClose: true,
          data: { displayName: person.displayName, invitation: { ...invitation, link } },
        });
        return;
      }
      this.tell(
        `A new invitation went to ${invitation.sentTo}; the link of any earlier one no longer works.`,
      );
    } catch (error) {
      this.tell(messageOf(error, 'The invitation could not be sent; try again.', 'sentence'));
    } finally {
      this.resending.set(null);
    }
  }

  protected resetPassword(person: Person): void {
    this.dialog.open(PasswordResetDialog, { ...CONFIRM_DIALOG, data: person });
  }

  private tell(message: string): void {
    this.snackBar.open(message, 'OK', { duration: 6000 });
  }
}
