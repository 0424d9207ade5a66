import { More } from '../components/Fold';
import { StorageStatus } from '../components/StorageStatus';
import { IconCaution } from '../components/icons';
import { SAFETY_CARDS } from '../../diagnose/safety';
import type { SafetyCardId } from '../../diagnose/types';
import { SafetyCards } from './diagnose/SafetyCards';

declare const __APP_VERSION__: string;

export function SafetyScreen() {
  return (
    <section class="screen">
      <h1>Safety &amp; about</h1>
      <div class="card caution" role="note">
        <h2 class="card-title"><IconCaution /> Before you touch the instrument</h2>
        <p>Generic guidance and ideal-physics values only. The instrument maker's procedures for the model, the site's rules and permits, local codes and licensed practice for electrical, gas and radiation work come first; where they differ, they win.</p>
        <ul class="hazard-lines">
          <li><strong>High voltage:</strong> kilovolt multiplier, dynode and spray supplies; hundreds to thousands of volts RF on the rods. Hazardous live above 33 V rms, 46.7 V peak or 70 V DC (IEC 61010-1:2010, 3rd ed., cl. 6.3.1 a), from memory).</li>
          <li><strong>RF burns</strong> come with little warning (IEC TS 60479-2:2017, from memory): monitor points or rated probes only.</li>
          <li><strong>Stored charge</strong> stays after switch-off: wait, then verify with a rated meter.</li>
          <li><strong>Covers off:</strong> lockout/tagout, discharge wait, prove dead. <strong>Live measurement:</strong> live-work authorisation and meters rated for the voltage. Never defeat an interlock.</li>
          <li><strong>Vacuum:</strong> vent only through the designated valve with dry gas; never above atmosphere.</li>
          <li><strong>Heat, chemicals, gases:</strong> hot sources and pumps; pump oil, solvents, calibrants; cylinders and asphyxiants. <strong>Tracers:</strong> never flammable, away from live parts and confined spaces.</li>
        </ul>
        <p class="muted">Each diagnosis step shows its hazard card and asks for acknowledgement before invasive or live work.</p>
      </div>

      <More title={`Hazard cards (${Object.keys(SAFETY_CARDS).length})`} testId="hazard-cards">
        <p class="muted">The same cards the diagnosis shows at each step. Tap one to open it.</p>
        <SafetyCards ids={Object.keys(SAFETY_CARDS) as SafetyCardId[]} />
      </More>

      <More title="Your data">
        <p>Instrument profiles, visits, readings and diagnosis walks are kept only in this browser's storage on this device. Nothing is sent anywhere.</p>
        <StorageStatus />
      </More>

      <More title="Published sources the computations are checked against">
        <ul class="sources">
          <li>DLMF, NIST Digital Library of Mathematical Functions, ch. 28 (Mathieu functions and Hill's equation).</li>
          <li>M. Abramowitz, I. A. Stegun, Handbook of Mathematical Functions, 1964, ch. 20 (eq. 20.2.25 small-q series).</li>
          <li>SciPy, scipy.special.mathieu_a / mathieu_b (reference library fixture).</li>
          <li>P. H. Dawson (ed.), Quadrupole Mass Spectrometry and its Applications, Elsevier, 1976.</li>
          <li>P. E. Miller, M. B. Denton, The quadrupole mass filter: basic operating concepts, J. Chem. Educ. 63 (1986) 617.</li>
          <li>D. J. Douglas, N. V. Konenkov, round-rod field radius, Rapid Commun. Mass Spectrom. 16 (2002).</li>
          <li>CODATA 2018 recommended values of the fundamental physical constants.</li>
          <li>J. F. O'Hanlon, A User's Guide to Vacuum Technology, 3rd ed., Wiley, 2003; K. Jousten (ed.), Handbook of Vacuum Technology, 2nd ed., 2016.</li>
          <li>CRC Handbook of Chemistry and Physics: ion-gauge relative sensitivities; composition of dry air.</li>
          <li>IEC 61010-1:2010 (3rd ed.), safety of laboratory equipment; NFPA 70E, 2024 edition; ISO 7010:2019 and ISO 3864-1:2011 (safety signs); IEC TS 60479-2:2017; IEC 60079-20-1:2010 — editions from memory. The hazard cards list the rest with their editions.</li>
        </ul>
      </More>
      <p class="muted">Rodside version <span data-testid="app-version">{__APP_VERSION__}</span>. Names, icons and layout are Rodside's own; demo instruments and visits are invented.</p>
    </section>
  );
}
