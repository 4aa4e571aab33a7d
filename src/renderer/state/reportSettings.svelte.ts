/**
 * The report's page settings (paper, orientation), shared by the Report view and the print and
 * export commands, and remembered in this browser's local storage between sessions.
 */
import { PAPERS, type Orientation, type Paper } from '../../report/index.ts';
import type { ReportSettings } from '../lib/reportDocument.ts';

const KEY = 'mixwise.report-settings';
const DEFAULTS: ReportSettings = { paper: 'A4', orientation: 'portrait' };

function loadSettings(): ReportSettings {
  try {
    const stored = JSON.parse(localStorage.getItem(KEY) ?? 'null') as Partial<ReportSettings> | null;
    const paper = (PAPERS as readonly unknown[]).includes(stored?.paper) ? (stored?.paper as Paper) : DEFAULTS.paper;
    const orientation: Orientation = stored?.orientation === 'landscape' ? 'landscape' : 'portrait';
    return { paper, orientation };
  } catch {
    return { ...DEFAULTS };
  }
}

class ReportSettingsState {
  private readonly initial = loadSettings();
  paper = $state<Paper>(this.initial.paper);
  orientation = $state<Orientation>(this.initial.orientation);

  /** Plain copy of the settings (for building a report). */
  get current(): ReportSettings {
    return { paper: this.paper, orientation: this.orientation };
  }

  set(settings: Partial<ReportSettings>): void {
    if (settings.paper !== undefined) this.paper = settings.paper;
    if (settings.orientation !== undefined) this.orientation = settings.orientation;
    try {
      localStorage.setItem(KEY, JSON.stringify(this.current));
    } catch {
      // Storage full or disabled: the choice holds for this session only.
    }
  }
}

export const reportSettings = new ReportSettingsState();
