import { ChangeDetectionStrategy, Component } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { RouterLink } from '@angular/router';

interface LessonSummary {
  readonly title: string;
  readonly covers: string;
}

/** The front page: what Flowlore teaches, who it serves, and the ten lessons. */
@Component({
  selector: 'fl-home-page',
  imports: [MatButton, RouterLink],
  templateUrl: './home-page.html',
  styleUrl: './home-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class HomePage {
  protected readonly lessons: readonly LessonSummary[] = [
    { title: 'Pressure', covers: 'Absolute, gauge and differential pressure; the units; reading a water-column manometer.' },
    { title: 'Pressure drop and restriction', covers: 'Why air moves, what “at a test pressure” means, and square-root scaling.' },
    { title: 'Volume flow', covers: 'CFM and its SI forms; how much air an engine asks for; port velocity.' },
    { title: 'Measuring flow against a reference', covers: 'Orifices, calibration, a part’s discharge coefficient, and what a comparative figure can tell you.' },
    { title: 'Air density', covers: 'Temperature, pressure, humidity and altitude; correcting to standard conditions.' },
    { title: 'Mass flow', covers: 'Density times volume flow, fuel and injectors, speed-density, and power potential.' },
    { title: 'Forced induction and intercooling', covers: 'Pressure ratio, compressor outlet temperature, intercoolers, and reading a compressor map.' },
    { title: 'Sensors', covers: 'How inline sensors work, their own restriction, and a mass-air sensor against the bench.' },
    { title: 'Repeatability and comparing tests', covers: 'Repeat runs, the uncertainty of a difference, and a test log another technician can trust.' },
    { title: 'Safety at the bench', covers: 'Noise, suction, compressed air, hot parts, lifting, dust and the electrical supply.' },
  ];
}
