package tui

import (
	"slices"
	"strings"

	"github.com/charmbracelet/bubbles/key"
	tea "github.com/charmbracelet/bubbletea"

	"enthalpath/cycle"
	"enthalpath/thermo"
	"enthalpath/tui/analyses"
	"enthalpath/tui/assembly"
	"enthalpath/tui/bench"
	"enthalpath/tui/filedialog"
	"enthalpath/tui/frame"
	"enthalpath/tui/header"
	"enthalpath/tui/keyhelp"
	"enthalpath/tui/modelpanel"
	"enthalpath/tui/nav"
	"enthalpath/tui/prompt"
	"enthalpath/tui/recovery"
	"enthalpath/tui/screen"
	"enthalpath/tui/session"
	"enthalpath/tui/shelf"
	"enthalpath/tui/status"
	"enthalpath/tui/survey"
	"enthalpath/tui/theme"
	"enthalpath/tui/unsaved"
)

// ShutdownMsg tells the workshop to stop (the SSH server is shutting down,
// or the local process got a signal): unsaved work goes to the recovery
// file and the program quits.
type ShutdownMsg struct{ Reason string }

// savedMsg is the answer of a save.
type savedMsg struct {
	path     string
	err      error
	thenQuit bool
	thenOpen *screen.OpenMsg // opened once saved
}

// Model is the root model of the workshop: it routes messages and composes
// the chrome's components (header, status, keyhelp, unsaved, filedialog,
// recovery) around the screen shown.
type Model struct {
	// Keys are the global keys.
	Keys KeyMap

	opts     Options
	ctx      *screen.Context
	sess     *session.Session
	screens  []screen.Screen
	active   screen.ID
	help     *keyhelp.Model
	status   status.Line
	question *unsaved.Question // asked before unsaved work is lost
	prompt   prompt.Slot       // a file name, asked over the screen
	files    filedialog.Folder // where file names are read
	keeper   recovery.Keeper   // writes the recovery files
	memo     *cycle.Memo       // one Ewald memo for every cycle this session opens
	win      frame.Window      // the terminal's size
	showHelp bool
	quitting bool
	// recovered is the recovery file written, for the last frame; kept
	// says where work was kept before an open, once it is done.
	recovered, kept string
}

var _ tea.Model = (*Model)(nil)

// New returns the workshop's root model for opts. Invalid options (see
// Validate) give a model that shows the problem and quits on any key.
func New(opts Options) tea.Model {
	if opts.MaxInputLen == 0 {
		opts.MaxInputLen = DefaultMaxInputLen
	}
	st := theme.DefaultStyles(opts.Renderer)
	m := &Model{Keys: DefaultKeyMap(), opts: opts, sess: &session.Session{}, memo: cycle.NewMemo(),
		help: keyhelp.New(st), question: unsaved.New(opts.RecoveryPath != ""), keeper: recovery.Keeper{Path: opts.RecoveryPath}}
	m.ctx = &screen.Context{Styles: st, Units: thermo.KJPerMol, DB: opts.DB, MaxInputLen: opts.MaxInputLen,
		ResolvePath: opts.resolver()}
	m.files = filedialog.Folder{Root: opts.FileRoot, Resolve: m.ctx.ResolvePath, DB: opts.DB, Styles: st,
		MaxInputLen: opts.MaxInputLen, Recovery: m.keeper.Files}
	if err := opts.Validate(); err != nil {
		m.status.Fail(err.Error())
	}
	m.screens = []screen.Screen{
		screen.Shelf:    shelf.New(m.ctx),
		screen.Bench:    bench.New(m.ctx, m.sess),
		screen.Assembly: assembly.New(m.ctx, m.sess),
		screen.Models:   modelpanel.New(m.ctx, m.sess),
		screen.Survey:   survey.New(m.ctx),
		screen.Analyses: analyses.New(m.ctx, m.sess),
	}
	m.win = frame.Window{Width: opts.Width, Height: opts.Height, MinWidth: MinWidth, MinHeight: MinHeight}
	m.layout()
	return m
}

// Session returns the session's state (for the program's runner and tests).
func (m *Model) Session() *session.Session { return m.sess }

// Active returns the screen shown.
func (m *Model) Active() screen.ID { return m.active }

// Screen returns screen id.
func (m *Model) Screen(id screen.ID) screen.Screen { return m.screens[id] }

// Context returns the shared context.
func (m *Model) Context() *screen.Context { return m.ctx }

// Init starts the screens and opens Options.Initial.
func (m *Model) Init() tea.Cmd {
	cmds := []tea.Cmd{m.keeper.Notice(m.Keys.Open.Help().Key, m.files.Name)}
	for _, s := range m.screens {
		cmds = append(cmds, s.Init())
	}
	if in := strings.TrimSpace(m.opts.Initial); in != "" {
		cmds = append(cmds, m.openCmd(session.Request(in)))
	}
	return tea.Batch(cmds...)
}

// Update routes a message. A panic anywhere below writes the recovery file
// first and then goes on up, so Bubble Tea restores the terminal.
func (m *Model) Update(msg tea.Msg) (model tea.Model, cmd tea.Cmd) {
	defer m.recoverAndRepanic()
	return m, m.update(msg)
}

func (m *Model) update(msg tea.Msg) tea.Cmd {
	switch msg := msg.(type) {
	case tea.WindowSizeMsg:
		m.win.Width, m.win.Height = msg.Width, msg.Height
		m.layout()
		return nil
	case ShutdownMsg:
		return m.shutdown(msg.Reason)
	case screen.StatusMsg:
		m.status.Set(msg.Text, msg.Err)
		return nil
	case recovery.NoticeMsg:
		if m.sess.Cycle == nil { // not over work begun meanwhile
			m.status.Notice(msg.Text)
		}
		return nil
	case screen.SwitchMsg:
		return m.switchTo(msg.To)
	case screen.OpenMsg:
		if m.sess.Dirty && m.sess.Cycle != nil {
			// Opening another compound replaces the cycle: ask first, with
			// the question the quit key asks.
			return m.ask(&msg)
		}
		return m.openCmd(msg)
	case session.LoadedMsg:
		return m.opened(msg)
	case savedMsg:
		return m.saved(msg)
	case session.SolvedMsg:
		if !m.sess.Apply(msg) {
			return nil
		}
		return m.broadcast(msg)
	case tea.KeyMsg:
		return m.key(msg)
	}
	return m.broadcast(msg)
}

func (m *Model) broadcast(msg tea.Msg) tea.Cmd {
	cmds := make([]tea.Cmd, 0, len(m.screens))
	for _, s := range m.screens {
		cmds = append(cmds, s.Update(msg))
	}
	return tea.Batch(cmds...)
}

// answered takes an error off the status line: the next key answers it
// (an error in the options stays).
func (m *Model) answered() {
	if m.opts.Validate() == nil {
		m.status.ClearError()
	}
}

func (m *Model) key(k tea.KeyMsg) tea.Cmd {
	m.answered()
	switch {
	case m.prompt.Active():
		if m.win.TooSmall() && k.Type != tea.KeyEsc {
			return nil // not drawn: only esc (cancel) acts
		}
		return m.prompt.Update(k)
	case m.question.Active():
		if m.win.TooSmall() && m.question.Small(m.win.Width, m.win.Height) == nil && !key.Matches(k, m.question.Keys.Back) {
			return nil // the question is not drawn: none of its answers acts
		}
		return m.answer(k)
	case m.win.TooSmall():
		if key.Matches(k, m.Keys.Quit, m.Keys.ForceQuit, m.question.Keys.Back) {
			return m.quit()
		}
		return nil
	}
	cur := m.screens[m.active]
	if k.Type == tea.KeyRunes && len(k.Runes) > 1 && !k.Paste && !cur.Capturing() {
		// Keys typed faster than the terminal is read arrive as one message
		// ("jj"): take them one at a time, as typed, so none is lost and a
		// key that starts typing (e) hands the rest to the text.
		cmds := make([]tea.Cmd, 0, len(k.Runes))
		for _, r := range k.Runes {
			cmds = append(cmds, m.key(tea.KeyMsg{Type: tea.KeyRunes, Runes: []rune{r}, Alt: k.Alt}))
		}
		return tea.Batch(cmds...)
	}
	// While the screen is typing, printable keys are text, not commands.
	global := func(b key.Binding) bool { return key.Matches(k, b) && !(cur.Capturing() && nav.Printable(k)) }
	switch {
	case key.Matches(k, m.Keys.ForceQuit):
		return m.quit()
	case m.showHelp && (global(m.Keys.Help) || key.Matches(k, m.question.Keys.Back) || global(m.Keys.Quit)):
		m.showHelp = false
		return nil
	case global(m.Keys.NextScreen):
		return m.switchTo((m.active + 1) % screen.ID(len(m.screens)))
	case global(m.Keys.PrevScreen):
		return m.switchTo((m.active + screen.ID(len(m.screens)) - 1) % screen.ID(len(m.screens)))
	case global(m.Keys.Save):
		return m.askSave(false, nil)
	case global(m.Keys.Open):
		m.prompt.Open(m.files.Open())
		return nil
	case global(m.Keys.Help):
		m.showHelp = !m.showHelp
		return nil
	case global(m.Keys.Quit):
		return m.quit()
	case global(m.Keys.Units):
		return m.nextUnits()
	case global(m.Keys.GoTo):
		return m.switchTo(screen.ID(k.Runes[0] - '1'))
	case m.showHelp:
		return nil
	}
	return cur.Update(k)
}

func (m *Model) nextUnits() tea.Cmd {
	units := thermo.Units()
	m.ctx.Units = units[(slices.Index(units, m.ctx.Units)+1)%len(units)]
	return tea.Batch(screen.Status("Energies now in "+m.ctx.Units.String()+"."), m.broadcast(screen.UnitsMsg{}))
}

func (m *Model) switchTo(id screen.ID) tea.Cmd {
	if id < 0 || int(id) >= len(m.screens) {
		return nil
	}
	m.active = id
	m.showHelp = false
	m.answered() // the error was about the screen left
	// The recovery notice is stale once a cycle is open (one of the files,
	// or other work chosen) or none of the files is there any more.
	m.status.DropNotice(func() bool { return m.sess.Cycle != nil || len(m.keeper.Files()) == 0 })
	return m.screens[id].Update(screen.ShownMsg{})
}

// layout hands every screen its body size.
func (m *Model) layout() {
	w, h := m.win.Body()
	for _, s := range m.screens {
		s.SetSize(w, h)
	}
	m.help.SetWidth(m.win.Width)
	m.prompt.SetWidth(min(w-6, 90))
}

// View draws the header, the body (screen, help, question or prompt), the
// status line and the help line.
func (m *Model) View() (out string) {
	defer m.recoverAndRepanic()
	st := m.ctx.Styles
	switch {
	case m.quitting && m.recovered != "":
		return "Unsaved work kept in " + m.files.Name(m.recovered) + "\n"
	case m.quitting:
		return ""
	case !m.win.Known():
		return "starting…"
	case m.win.TooSmall() && m.question.Active():
		return m.win.Small(st, m.question.SmallView(st, m.win.Width, m.win.Height))
	case m.win.TooSmall() && m.prompt.Active():
		return m.win.Small(st, st.Warn.Render("A file name is asked; enlarge the window to see it, or press esc to cancel."))
	case m.win.TooSmall():
		return m.win.Small(st, st.Warn.Render(m.win.TooSmallText(m.Keys.Quit.Help().Key)))
	}
	var body string
	switch {
	case m.prompt.Active():
		body = m.win.Overlay(st, m.prompt.View())
	case m.question.Active():
		body = m.win.Overlay(st, m.question.View(st, m.win.OverlayWidth(), m.files.Name(m.keeper.Next())))
	case m.showHelp:
		title := st.Title.Render("Keys on the "+m.screens[m.active].Title()+" screen, then everywhere") + st.Muted.Render(" (esc closes)")
		body = m.win.Overlay(st, m.help.Overlay(title, m.FullHelp(), "While typing (Shelf, values, file names) letters are text: use tab, ctrl keys, f1, esc.", m.win.OverlayWidth()))
	default:
		body = m.screens[m.active].View()
	}
	top := header.Line{Active: int(m.active), Unit: m.ctx.Units.String()}
	for _, s := range m.screens {
		top.Titles = append(top.Titles, s.Title())
	}
	if c := m.sess.Cycle; c != nil {
		top.Compound, top.Unsaved = c.Formula, m.sess.Dirty
	}
	idle := "enthalpath workshop — " + m.helpKeys() + " lists every key"
	return m.win.Compose(st, top.View(st, m.win.Width), body,
		m.status.View(st, m.win.Width, m.files.Shown, m.files.Name(m.sess.Path), idle), m.helpLine())
}
