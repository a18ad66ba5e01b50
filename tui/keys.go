package tui

import (
	"strings"

	"github.com/charmbracelet/bubbles/key"

	"enthalpath/tui/keyhelp"

	"enthalpath/tui/nav"
)

// KeyMap is the workshop's global keys. Screens have their own; the root
// only acts on a printable global key when the screen is not typing.
type KeyMap struct {
	NextScreen, PrevScreen, GoTo key.Binding
	Units, Help                  key.Binding
	Save, Open                   key.Binding
	Quit, ForceQuit              key.Binding
}

// DefaultKeyMap returns the global keys.
func DefaultKeyMap() KeyMap {
	return KeyMap{
		NextScreen: nav.NextScreen.Bind("next screen"),
		PrevScreen: nav.PrevScreen.Bind("previous screen"),
		GoTo:       nav.New("go to screen by number", "1", "2", "3", "4", "5", "6"),
		Units:      nav.New("units kJ/mol → kcal/mol → eV", "u"),
		Help:       nav.Help.Bind("all keys"),
		Save:       nav.New("save the cycle file", "ctrl+s"),
		Open:       nav.New("open a cycle file", "ctrl+o"),
		Quit:       nav.Quit.Bind("quit"),
		ForceQuit:  nav.ForceQuit.Bind("quit (asks if unsaved)"),
	}
}

// globals are the global keys as the help shows them: the line ends with
// the key list and quit (ctrl+c while the screen is typing), the key list
// follows the screen's keys with two groups.
func (k KeyMap) globals() keyhelp.Globals {
	return keyhelp.Globals{
		End:       []key.Binding{k.Help, k.Quit},
		EndTyping: []key.Binding{k.Help, k.ForceQuit},
		Groups:    [][]key.Binding{{k.NextScreen, k.PrevScreen, k.GoTo, k.Units}, {k.Save, k.Open, k.Help, k.Quit, k.ForceQuit}},
		Idle:      k.GoTo,
	}
}

func (m *Model) helpLine() string {
	switch {
	case m.prompt.Active():
		return m.help.Plain(m.prompt.ShortHelp())
	case m.question.Active():
		// The question's box says what follows each answer; the line
		// keeps every key with its bare name rather than lose the last.
		return m.help.Answers(m.question.Bindings(), m.question.Declared())
	}
	return m.help.Line(m.Keys.globals().Short(m.screens[m.active]))
}

// ShortHelp is the always-visible help line: the screen's main keys and
// the few global ones; while a file name or the question is asked, their
// keys.
func (m *Model) ShortHelp() []key.Binding {
	switch {
	case m.prompt.Active():
		return m.prompt.ShortHelp()
	case m.question.Active():
		return m.question.Bindings()
	}
	own, globals := m.Keys.globals().Short(m.screens[m.active])
	return append(own, globals...)
}

// FullHelp is the key list: the screen's keys, then the global keys that
// act on it.
func (m *Model) FullHelp() [][]key.Binding { return m.Keys.globals().Full(m.screens[m.active]) }

// helpKeys names the keys that open the key list on the screen shown ("?
// or f1"; "f1" while the screen is typing, when ? is text).
func (m *Model) helpKeys() string {
	b := m.Keys.Help
	if m.screens[m.active].Capturing() {
		b, _ = nav.WithoutPrintable(b)
	}
	return strings.Join(b.Keys(), " or ")
}
