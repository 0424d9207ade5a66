// Our own line icons, drawn for Rodside (24 × 24 grid, stroke only).
import type { JSX } from 'preact';

function Svg(props: { children: JSX.Element | JSX.Element[] }) {
  return (
    <svg viewBox="0 0 24 24" width="24" height="24" fill="none" stroke="currentColor" stroke-width="1.8"
      stroke-linecap="round" stroke-linejoin="round" aria-hidden="true" focusable="false">
      {props.children}
    </svg>
  );
}

/** Four rod ends seen along the axis. */
export const IconRods = () => (
  <Svg>
    <circle cx="12" cy="5.5" r="3" /><circle cx="12" cy="18.5" r="3" /><circle cx="5.5" cy="12" r="3" /><circle cx="18.5" cy="12" r="3" />
  </Svg>
);
/** A pointed region over an axis. */
export const IconRegion = () => (
  <Svg>
    <path d="M3 20h18" /><path d="M4 20c3-2 6-9 9-14 1.5 4 3.5 9 6 14" /><circle cx="13" cy="6" r="1.2" />
  </Svg>
);
export const IconPeak = () => (
  <Svg>
    <path d="M3 20h18" /><path d="M4 19c4 0 5-13 8-13s4 13 8 13" />
  </Svg>
);
/** Sticks of a measured spectrum over an axis. */
export const IconSpectrum = () => (
  <Svg>
    <path d="M3 20h18" /><path d="M6 20v-6" /><path d="M10 20V6" /><path d="M14 20v-9" /><path d="M18 20v-3" />
  </Svg>
);
/** Branching path. */
export const IconWalk = () => (
  <Svg>
    <circle cx="6" cy="5" r="2" /><circle cx="6" cy="19" r="2" /><circle cx="18" cy="12" r="2" /><path d="M6 7v10" /><path d="M6 9c0 3 5 3 10 3" />
  </Svg>
);
/** Clipboard with lines. */
export const IconLog = () => (
  <Svg>
    <rect x="5" y="4" width="14" height="17" rx="2" /><path d="M9 4V3h6v1" /><path d="M8.5 10h7M8.5 14h7M8.5 18h4" />
  </Svg>
);
export const IconInstrument = () => (
  <Svg>
    <rect x="3" y="7" width="18" height="11" rx="2" /><path d="M7 11h5M7 14h3" /><circle cx="16.5" cy="12.5" r="2" /><path d="M8 7V5h8v2" />
  </Svg>
);
/** Triangle with a bar: caution. */
export const IconCaution = () => (
  <Svg>
    <path d="M12 3 2.5 20h19z" /><path d="M12 10v4.5" /><circle cx="12" cy="17.2" r=".6" />
  </Svg>
);
export const IconHome = () => (
  <Svg>
    <rect x="4" y="4" width="7" height="7" rx="1.5" /><rect x="13" y="4" width="7" height="7" rx="1.5" /><rect x="4" y="13" width="7" height="7" rx="1.5" /><rect x="13" y="13" width="7" height="7" rx="1.5" />
  </Svg>
);
export const IconBolt = () => (
  <Svg>
    <path d="M13 2 5 13h6l-1 9 8-11h-6z" />
  </Svg>
);
