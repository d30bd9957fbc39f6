import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { signal, type Provider } from '@angular/core';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { provideRouter } from '@angular/router';
import type { RevisionView } from '@shared/api/revisions';
import { AuthService } from '../../core/auth/auth-service';
import { REVISION_PATHS } from '../../speed-books/revisions-api';
import { revisionSummary, revisionView, sessionUser, speedBook } from '../../speed-books/testing/revision-fixtures';
import { LIVE_COVERAGE_DEBOUNCE_MS } from '../live-coverage';
import { RevisionEditor } from '../revision-editor';

/** The draft every editor spec opens: revision 3 of speed book 1. */
export const DRAFT_ID = 9;

export interface RevisionEditorHarness {
  readonly fixture: ComponentFixture<RevisionEditor>;
  readonly backend: HttpTestingController;
  readonly page: HTMLElement;
  /** The draft as the server answers it, with `content`. */
  draft(content: Record<string, unknown>): RevisionView;
  /**
   * Opens the draft with `content` in `into` (the harness's fixture, or a fresh one a test made to
   * load the draft again): answers the revision, its speed book and its attachments.
   */
  openDraft(content: Record<string, unknown>, into?: ComponentFixture<RevisionEditor>): Promise<void>;
}

/**
 * The revision editor as an engineer sees it, against `HttpTestingController`, with Material's
 * animations off. `liveCoverageDebounceMs` sets the live coverage sweep's pause (the app's own
 * when absent). Call it in `beforeEach`; the spec calls `backend.verify()` after each test.
 */
export function setUpRevisionEditor(options: { changeSummary: string; liveCoverageDebounceMs?: number }): RevisionEditorHarness {
  const coverage: Provider[] = options.liveCoverageDebounceMs === undefined ? [] : [{ provide: LIVE_COVERAGE_DEBOUNCE_MS, useValue: options.liveCoverageDebounceMs }];
  TestBed.configureTestingModule({
    imports: [RevisionEditor],
    providers: [
      provideHttpClient(),
      provideHttpClientTesting(),
      provideRouter([]),
      { provide: AuthService, useValue: { user: signal(sessionUser('engineer')) } },
      { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
      ...coverage,
    ],
  });
  const backend = TestBed.inject(HttpTestingController);
  const fixture = TestBed.createComponent(RevisionEditor);
  const draft = (content: Record<string, unknown>) =>
    revisionView(content, { id: DRAFT_ID, number: 3, status: 'draft', approverId: null, approverName: null, publishedAt: null, submittedAt: null, contentSha256: null, changeSummary: options.changeSummary });
  return {
    fixture,
    backend,
    page: fixture.nativeElement as HTMLElement,
    draft,
    async openDraft(content, into = fixture) {
      into.componentRef.setInput('revisionId', DRAFT_ID);
      await into.whenStable();
      backend.expectOne(REVISION_PATHS.revision(DRAFT_ID)).flush({ revision: draft(content) });
      backend.expectOne(REVISION_PATHS.speedBook(1)).flush({ speedBook: speedBook([revisionSummary({ id: DRAFT_ID, number: 3, status: 'draft' }), revisionSummary()]) });
      await into.whenStable();
      backend.expectOne(REVISION_PATHS.attachments(DRAFT_ID)).flush({ attachments: [] });
      await into.whenStable();
    },
  };
}
