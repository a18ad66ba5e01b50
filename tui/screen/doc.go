// Package screen is the small shared contract of the workshop's screens:
// the Screen interface every screen implements, the Context handed to each
// (styles, units, data, limits), and the messages screens send to the root
// model to open a compound, switch screens or report a status.
package screen
