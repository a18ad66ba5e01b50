// Package shelf is the workshop's start screen: every compound of the data
// (built-in and the user's overlay) with its formation enthalpy and
// structure, filtered as the user types, and a free formula line for a
// compound the data do not have. It opens on the demo shortlist of an
// invented study (see Scenario).
package shelf
