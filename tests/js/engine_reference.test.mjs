// The JavaScript engine against values from outside the project (published tables,
// textbook relations, the binding values of SPEC section 3 and 4). The parity test
// (engine.test.mjs) already ties every function to Python; these checks catch an error
// that both engines would share. Run: node --test tests/js/

import { test } from 'node:test';
import assert from 'node:assert/strict';

import { HP, LB, LB_PER_HP_H } from '../../static/js/engine/constants.js';
import * as atmosphere from '../../static/js/engine/atmosphere.js';
import * as compressor from '../../static/js/engine/compressor.js';
import * as power from '../../static/js/engine/power.js';
import * as airflow from '../../static/js/engine/airflow.js';
import * as fuel from '../../static/js/engine/fuel.js';

/** |actual - expected| <= rel |expected| */
function near(actual, expected, rel, what) {
  assert.ok(Math.abs(actual - expected) <= rel * Math.abs(expected), `${what}: ${actual}, expected ${expected} (rel ${rel})`);
}

// US Standard Atmosphere 1976, Table I (geometric altitude), from memory: pressure,
// temperature, density. The table prints 5 significant digits, so 1e-4 relative.
const USSA_TABLE_I = [
  [1000, 8.9876e4, 281.651, 1.1117],
  [2000, 7.9501e4, 275.154, 1.0066],
  [5000, 5.4048e4, 255.676, 0.73643],
  [11000, 2.2700e4, 216.774, 0.36480],
];

test('standard atmosphere matches US Standard Atmosphere 1976, Table I', () => {
  // US Standard Atmosphere 1976: sea-level values are defining constants
  assert.equal(atmosphere.isaPressure(0), 101325);
  assert.equal(atmosphere.isaTemperature(0), 288.15);
  for (const [h, p, T, rho] of USSA_TABLE_I) {
    near(atmosphere.isaPressure(h), p, 1e-4, `P(${h} m)`);
    near(atmosphere.isaTemperature(h), T, 1e-5, `T(${h} m)`);
    near(atmosphere.humidAirDensity(atmosphere.isaPressure(h), atmosphere.isaTemperature(h), 0), rho, 1e-4, `rho(${h} m)`);
    // pressure altitude is the inverse of the table's pressure column
    near(atmosphere.pressureAltitude(p), h, 1e-3, `pressure altitude of ${p} Pa`);
  }
});

test('NWS altimeter formula differs from the standard atmosphere as SPEC section 4 states', () => {
  // SPEC section 4: about 17 Pa at 2000 m and 90 Pa at 11 km (rounded NWS constants)
  const d2000 = atmosphere.isaPressure(2000) - atmosphere.stationPressureFromAltimeter(101325, 2000);
  const d11000 = atmosphere.isaPressure(11000) - atmosphere.stationPressureFromAltimeter(101325, 11000);
  assert.ok(Math.abs(d2000) > 10 && Math.abs(d2000) < 25, `2000 m: ${d2000} Pa`);
  assert.ok(Math.abs(d11000) > 80 && Math.abs(d11000) < 100, `11 km: ${d11000} Pa`);
  // NWS: at sea level the station pressure equals the altimeter setting
  assert.equal(atmosphere.stationPressureFromAltimeter(101325, 0), 101325);
  near(atmosphere.altimeterFromStationPressure(atmosphere.stationPressureFromAltimeter(99e3, 1800), 1800), 99e3, 1e-12, 'round trip');
});

test('saturation vapour pressure agrees with steam tables', () => {
  // IAPWS-IF97 saturation pressure, 20 degC: 2.3393 kPa (from memory); Buck is within 0.05 %
  near(atmosphere.saturationVapourPressure(293.15), 2339.3, 1e-3, 'Psat(20 degC)');
  // IAPWS-IF97, 40 degC: 7.3849 kPa (from memory)
  near(atmosphere.saturationVapourPressure(313.15), 7384.9, 1e-3, 'Psat(40 degC)');
});

test('SAE J1349 correction factor at its standard conditions and at ISA sea level', () => {
  // SAE J1349: 99 kPa dry air and 25 degC are the standard conditions, CF = 1
  near(atmosphere.saeJ1349CorrectionFactor(99e3, 298.15), 1.0, 1e-12, 'CF(standard)');
  // SPEC section 4: ISA sea level gives about 0.95, not 1
  near(atmosphere.saeJ1349CorrectionFactor(101325, 288.15), 0.954, 1e-3, 'CF(ISA sea level)');
});

test('density altitude of the standard atmosphere is the altitude itself', () => {
  // US Standard Atmosphere 1976: the density column of Table I inverted
  for (const [h, , , rho] of USSA_TABLE_I) near(atmosphere.densityAltitude(rho), h, 2e-3, `density altitude of ${rho}`);
});

test('isentropic compression follows T2/T1 = PR^((k-1)/k)', () => {
  // ideal gas isentropic relation (Heywood 1988, eq. 6.32 with eta = 1): 288.15 K at PR 2
  near(compressor.outletTemperature(288.15, 2, 1), 288.15 * 2 ** (0.4 / 1.4), 1e-14, 'T2');
  // efficiency 0.5 doubles the temperature rise (definition of isentropic efficiency)
  const rise = compressor.outletTemperature(300, 2.5, 0.5) - 300;
  near(rise, 2 * (compressor.outletTemperature(300, 2.5, 1) - 300), 1e-12, 'rise');
});

test('one atmosphere of boost ideally doubles NA power (the trade\'s pressure-ratio rule)', () => {
  // common practice, no source (SPEC section 4)
  const [mapAbs] = compressor.pressures(101325, 101325);
  near(power.idealPower(150e3, mapAbs, 101325), 300e3, 1e-15, 'ideal');
  // SPEC section 4: a turbo with a perfect intercooler at the NA temperature, no losses
  // and the default exhaust pressure gives expected = ideal
  const r = power.expectedPower(101325, {
    naPower: 150e3, pNa: 101325, TNa: 298.15, naAirMassFlow: 0.16, pBaro: 101325, T1: 298.15,
    effectiveness: 1, TCoolant: 298.15,
  });
  near(r.expected, r.ideal, 1e-12, 'expected vs ideal');
  const [boost] = power.boostForExpectedPower(300e3, 3 * 101325, (b) => power.expectedPower(b, {
    naPower: 150e3, pNa: 101325, TNa: 298.15, naAirMassFlow: 0.16, pBaro: 101325, T1: 298.15,
    effectiveness: 1, TCoolant: 298.15,
  }).expected);
  assert.ok(Math.abs(boost - 101325) <= power.BISECTION_WIDTH, `boost ${boost}`);
});

test('air per power and BSFC units', () => {
  // NIST SP 811: 1 lb = 0.45359237 kg, 1 hp = 745.69987158227 W
  near(LB_PER_HP_H, 0.45359237 / (745.69987158227 * 3600), 1e-15, 'lb/hp/h');
  // 0.50 lb/hp/h at AFR 12.5 is 6.25 lb/h of air per hp: about 9.6 hp per lb/min (SPEC section 4)
  near(airflow.airMassFlow(HP, 0.5 * LB_PER_HP_H, 12.5) * 3600 / LB, 6.25, 1e-12, 'air per hp');
  // Heywood 1988, eq. 2.27: VE = 1 when the cylinders fill at manifold density
  near(airflow.volumetricEfficiency(1.2 * 2e-3 * 6000 / 120, 1.2, 2e-3, 6000), 1, 1e-12, 'VE');
});

test('fuel table and E85 blend have the binding values of SPEC section 3', () => {
  // SPEC section 3 fuel table: densities and stoichiometric AFR
  assert.deepEqual(fuel.fuelProperties('gasoline'), [745, 14.7]);
  assert.deepEqual(fuel.fuelProperties('ethanol'), [789, 9.0]);
  assert.deepEqual(fuel.fuelProperties('methanol'), [791, 6.47]);
  const [rho, afr] = fuel.fuelProperties('e85');
  near(rho, 782.4, 1e-12, 'E85 density');
  near(afr, 9.814, 1e-4, 'E85 AFR'); // SPEC: computed 9.814
  // stoichiometry of C2H5OH: 3 O2 per molecule, air 23.2 % O2 by mass (from memory): about 9.0
  near((3 * 31.998) / 0.232 / 46.068, 9.0, 1e-2, 'ethanol AFR from stoichiometry');
});

test('injector and pump relations', () => {
  // ISO 5167-1 orifice equation: flow scales with the square root of the pressure difference
  assert.equal(fuel.orificeScale(4e5, 1e5), 2);
  // a fixed regulator loses one bar of injector pressure per bar of boost (definition)
  assert.equal(fuel.injectorPressureDifference(3e5, 1e5, 'fixed'), 2e5);
  assert.equal(fuel.injectorPressureDifference(3e5, 1e5, 'boost_referenced'), 3e5);
  // the sized injector runs at exactly its max duty at the power it was sized for
  const flow = fuel.injectorFlowNeeded(300e3, fuel.sizingBsfc('turbo', 14.7), 6, 0.8);
  near(fuel.injectorDuty(300e3, fuel.sizingBsfc('turbo', 14.7), 6, flow), 0.8, 1e-14, 'duty');
  near(fuel.injectorMaxPower(flow, 6, 0.8, fuel.sizingBsfc('turbo', 14.7)), 300e3, 1e-14, 'max power');
  // n-heptane (about 684 kg/m^3, from memory) against gasoline: about 4 % (SPEC section 4)
  near(1 / fuel.ratingFluidScale(745, 684), 1.044, 2e-3, 'test-fluid overstatement');
  // a straight pump line: extrapolation continues it, and flow never goes below 0
  const [f1, e1] = fuel.pumpCurveFlow([1e5, 3e5, 5e5], [3e-5, 2e-5, 1e-5], 6e5);
  near(f1, 5e-6, 1e-9, 'extrapolated flow');
  assert.equal(e1, true);
  assert.deepEqual(fuel.pumpCurveFlow([1e5, 3e5, 5e5], [3e-5, 2e-5, 1e-5], 9e5), [0, true]);
  assert.deepEqual(fuel.pumpCurveFlow([1e5, 3e5, 5e5], [3e-5, 2e-5, 1e-5], 3e5), [2e-5, false]);
});
