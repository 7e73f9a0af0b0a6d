import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import type { Study } from '@shared/schemas';

/** Under a study's heading (the study page, the review page): the release the study belongs to and the requirement it meets there. */
@Component({
  selector: 'app-study-release',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatIconModule, RouterLink],
  template: `
    @if (release(); as r) {
      <p class="release" data-testid="study-release">
        <mat-icon aria-hidden="true" inline>rocket_launch</mat-icon>
        Part of release <a [routerLink]="['/releases', r.id]">{{ r.title }}</a> ({{ r.requirement }})
      </p>
    }
  `,
  styles: `
    :host { display: block; }
    .release { margin: 4px 0 0; }
  `,
})
export class StudyRelease {
  readonly release = input.required<Study['release']>();
}
