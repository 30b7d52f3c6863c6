"""Physical constants shared by every model (binding values of the product spec).

The gas constant for dry air is the one consistent with the US Standard Atmosphere
1976 and the ICAO Standard Atmosphere (R* / M = 8314.32 / 28.964420, ICAO Doc 7488;
the 1976 tables round M0 to 28.9644, which agrees to 1e-6); the others are standard
handbook values.
"""

R_DRY = 287.05287  #: gas constant of dry air, [J/(kg K)] (US Standard Atmosphere 1976)
R_VAPOUR = 461.5  #: gas constant of water vapour, [J/(kg K)] (handbook value)
CP_AIR = 1005.0  #: specific heat of air at constant pressure, [J/(kg K)]
GAMMA_AIR = 1.4  #: ratio of specific heats of air, [-]
G0 = 9.80665  #: standard gravity, [m/s^2]
R_EARTH = 6356766.0  #: effective earth radius for geopotential height, [m] (USSA 1976)

P_SEA_LEVEL = 101325.0  #: ISA sea-level pressure, [Pa]
T_SEA_LEVEL = 288.15  #: ISA sea-level temperature, [K]
RHO_SEA_LEVEL = 1.225  #: ISA sea-level density, [kg/m^3]
LAPSE_RATE = 0.0065  #: troposphere temperature lapse rate, [K/m] (geopotential)
#: exponent g0 / (R lapse) of the troposphere pressure law, [-]
PRESSURE_EXPONENT = 5.25588

#: conversions used by formulas that are stated in customary units
LB = 0.45359237  #: pound, [kg] (NIST SP 811)
HP = 745.69987158227  #: mechanical horsepower, [W] (NIST SP 811)
LB_PER_HP_H = LB / (HP * 3600.0)  #: 1 lb/hp/h in [kg/J]
