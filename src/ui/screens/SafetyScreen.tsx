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
        <p>Rodside gives generic guidance and expected values from ideal physics. It does not replace the instrument maker's procedures for the exact model, the site's safety rules and permits, local codes and regulations, or licensed and authorised practice for electrical, gas and radiation work. Where they differ, they win.</p>
        <ul>
          <li><strong>High voltage:</strong> multiplier, conversion-dynode and spray supplies reach kilovolts; RF on the rods reaches hundreds to thousands of volts at about 1 MHz. IEC 61010-1:2010 (3rd ed.) cl. 6.3.1 a) treats parts above 33 V rms, 46.7 V peak or 70 V DC as hazardous live in normal dry conditions (from memory; check the edition you work to).</li>
          <li><strong>RF burns</strong> at these frequencies can happen with little warning sensation (IEC TS 60479-2:2017, from memory). Measure only at monitor points or with probes rated for the voltage at that frequency.</li>
          <li><strong>Stored charge</strong> remains in HV supplies, cables and RF tanks after switch-off: wait, then verify with a rated instrument.</li>
          <li><strong>Vacuum:</strong> vent only through the designated valve with dry gas at low regulated pressure; never pressurise above atmosphere.</li>
          <li><strong>Hot surfaces</strong> in sources, transfer lines and pumps; <strong>chemicals</strong> in pump oil, solvents and calibrants; <strong>gas cylinders</strong> and asphyxiant gases.</li>
          <li>Use lockout/tagout, wait the discharge time and prove the absence of voltage before any work behind covers. A measurement on a running instrument is live work instead: it needs live-work authorisation and meters and probes rated for the voltage present. Never defeat an interlock.</li>
          <li><strong>Tracer gases:</strong> never a flammable tracer; keep helium or argon sprays away from live parts and HV feedthroughs, and out of confined spaces.</li>
        </ul>
        <p class="muted">The guided diagnosis shows the matching hazard card at each step and asks for acknowledgement before invasive work.</p>
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
