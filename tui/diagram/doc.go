// Package diagram draws an energy-level diagram to scale: levels as
// horizontal lines at their enthalpy, each step an up or down arrow from one
// level to another with its value, the unknown step marked. It knows nothing
// of chemistry; callers hand it levels and arrows. It renders as text for the
// terminal (Render) and as a standalone SVG document (WriteSVG).
package diagram
