// Physical constants, CODATA 2018 recommended values (SI). e and k_B are exact since the 2019 SI redefinition.

/** Elementary charge e in C (CODATA 2018, exact). */
export const ELEMENTARY_CHARGE = 1.602176634e-19;
/** Atomic mass constant m_u = 1 u in kg (CODATA 2018). */
export const ATOMIC_MASS_CONSTANT = 1.6605390666e-27;
/** Boltzmann constant k_B in J/K (CODATA 2018, exact). */
export const BOLTZMANN_CONSTANT = 1.380649e-23;
/** 1 Torr in Pa: 101325/760 (exact by definition, NIST SP 811). */
export const PASCAL_PER_TORR = 101325 / 760;
/** 1 mbar in Pa (exact). */
export const PASCAL_PER_MBAR = 100;
