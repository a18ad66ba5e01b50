// Package notation reads and writes chemical notation: formulas with
// counts, nested brackets and polyatomic groups (ParseFormula), ion
// symbols and their charges (ParseIon, IonReadings, IonSymbol,
// ChargeSuffix), and the periodic table's symbols (AtomicNumber,
// SymbolOfZ).
//
// It is a leaf: it knows no data and no physics and imports nothing of the
// project, so that the data tables, the engine, the CIF reader and the
// front ends all read a formula or an ion the same way.
package notation
