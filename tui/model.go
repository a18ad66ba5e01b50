package tui

import (
	"errors"
	"fmt"
	"os"
	"path/filepath"
	"slices"
	"strings"

	"github.com/charmbracelet/bubbles/help"
	"github.com/charmbracelet/bubbles/key"
	tea "github.com/charmbracelet/bubbletea"
	"github.com/charmbracelet/lipgloss"
	"github.com/charmbracelet/x/ansi"

	"enthalpath/cycle"
	"enthalpath/thermo"
	"enthalpath/tui/analyses"
	"enthalpath/tui/assembly"
	"enthalpath/tui/bench"
	"enthalpath/tui/modelpanel"
	"enthalpath/tui/nav"
	"enthalpath/tui/prompt"
	"enthalpath/tui/screen"
	"enthalpath/tui/session"
	"enthalpath/tui/shelf"
	"enthalpath/tui/survey"
	"enthalpath/tui/theme"
)

// ShutdownMsg tells the workshop to stop (the SSH server is shutting down,
// or the local process got a signal): unsaved work goes to the recovery
// file and the program quits.
type ShutdownMsg struct{ Reason string }

// openedMsg is the answer of an open request.
type openedMsg struct {
	c      *cycle.Cycle
	path   string
	guided bool
	err    error
}

// savedMsg is the answer of a save.
type savedMsg struct {
	path     string
	err      error
	thenQuit bool
	thenOpen *screen.OpenMsg // opened once saved
}

// Model is the root model of the workshop.
type Model struct {
	// Keys are the global keys, Confirm those of the unsaved-changes question.
	Keys    KeyMap
	Confirm ConfirmKeys

	opts    Options
	ctx     *screen.Context
	sess    *session.Session
	screens []screen.Screen
	active  screen.ID
	help    help.Model

	width, height int
	status        string
	statusErr     bool
	showHelp      bool
	confirming    bool
	pending       *screen.OpenMsg // what the question is about: nil to quit, else this open
	prompt        prompt.Slot     // a file name, asked over the screen
	quitting      bool
	recovered     string // path of the recovery file written, for the last frame
	notice        string // the recovery notice of the start, while shown
	kept          string // where the work was kept before an open, said when it is done
	// lastKept is the recovery file keepWork wrote last and what it holds.
	lastKept struct {
		path    string
		content []byte
	}
	memo *cycle.Memo
}

var _ tea.Model = (*Model)(nil)

// New returns the workshop's root model for opts. Invalid options (see
// Validate) give a model that shows the problem and quits on any key.
func New(opts Options) tea.Model {
	if opts.MaxInputLen == 0 {
		opts.MaxInputLen = DefaultMaxInputLen
	}
	st := theme.DefaultStyles(opts.Renderer)
	m := &Model{Keys: DefaultKeyMap(), Confirm: DefaultConfirmKeys(), opts: opts, sess: &session.Session{},
		memo: cycle.NewMemo()} // one Ewald memo for every cycle this session opens
	m.ctx = &screen.Context{Styles: st, Units: thermo.KJPerMol, DB: opts.DB, MaxInputLen: opts.MaxInputLen,
		ResolvePath: opts.resolver()}
	m.help = help.New()
	m.help.ShortSeparator = " · "
	m.help.Styles = help.Styles{
		Ellipsis: st.HelpSep, ShortKey: st.HelpKey, ShortDesc: st.HelpDesc, ShortSeparator: st.HelpSep,
		FullKey: st.HelpKey, FullDesc: st.HelpDesc, FullSeparator: st.HelpSep,
	}
	if err := opts.Validate(); err != nil {
		m.status, m.statusErr = err.Error(), true
	}
	m.screens = []screen.Screen{
		screen.Shelf:    shelf.New(m.ctx),
		screen.Bench:    bench.New(m.ctx, m.sess),
		screen.Assembly: assembly.New(m.ctx, m.sess),
		screen.Models:   modelpanel.New(m.ctx, m.sess),
		screen.Survey:   survey.New(m.ctx),
		screen.Analyses: analyses.New(m.ctx, m.sess),
	}
	m.width, m.height = opts.Width, opts.Height
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
	cmds := []tea.Cmd{m.checkRecovery()}
	for _, s := range m.screens {
		cmds = append(cmds, s.Init())
	}
	if in := strings.TrimSpace(m.opts.Initial); in != "" {
		cmds = append(cmds, m.openCmd(initialRequest(in)))
	}
	return tea.Batch(cmds...)
}

func initialRequest(in string) screen.OpenMsg {
	if strings.HasSuffix(in, cycle.FileExtension) || strings.ContainsRune(in, '/') {
		return screen.OpenMsg{File: in}
	}
	if st, err := os.Stat(in); err == nil && st.Mode().IsRegular() {
		return screen.OpenMsg{File: in}
	}
	return screen.OpenMsg{Formula: in}
}

func (m *Model) checkRecovery() tea.Cmd {
	p := m.opts.RecoveryPath
	if p == "" {
		return nil
	}
	return func() tea.Msg {
		files := recoveryFiles(p)
		switch len(files) {
		case 0:
			return nil
		case 1:
			// The key first and the name last: a long local path cut at
			// the window's edge is whole in the ctrl+o prompt.
			return recoveryNoticeMsg{text: "A recovery file from an earlier session (ctrl+o opens it): " + m.name(files[0])}
		}
		return recoveryNoticeMsg{text: fmt.Sprintf("%d recovery files from earlier sessions (ctrl+o opens the newest): %s",
			len(files), m.name(files[0]))}
	}
}

// recoveryNoticeMsg announces the recovery files found at the start.
type recoveryNoticeMsg struct{ text string }

// noticeDealtWith reports whether the recovery notice shown no longer
// applies: a cycle is open (one of the files, or other work chosen), or
// none of the announced files is there any more.
func (m *Model) noticeDealtWith() bool {
	return m.sess.Cycle != nil || len(recoveryFiles(m.opts.RecoveryPath)) == 0
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
		m.width, m.height = msg.Width, msg.Height
		m.layout()
		return nil
	case ShutdownMsg:
		return m.shutdown(msg.Reason)
	case screen.StatusMsg:
		m.status, m.statusErr = msg.Text, msg.Err
		return nil
	case recoveryNoticeMsg:
		if m.sess.Cycle == nil && m.status == "" { // not over work begun meanwhile
			m.status, m.statusErr, m.notice = msg.text, false, msg.text
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
	case openedMsg:
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

func (m *Model) key(k tea.KeyMsg) tea.Cmd {
	if m.statusErr && m.opts.Validate() == nil {
		// An error is answered by the next key: it does not stay on.
		m.status, m.statusErr = "", false
	}
	if m.prompt.Active() {
		if m.tooSmall() && k.Type != tea.KeyEsc {
			return nil // not drawn: only esc (cancel) acts
		}
		return m.prompt.Update(k)
	}
	if m.confirming {
		if m.tooSmall() && m.smallQuestion() == nil && !key.Matches(k, m.Confirm.Back) {
			return nil // the question is not drawn: none of its answers acts
		}
		return m.confirmKey(k)
	}
	if m.tooSmall() {
		if key.Matches(k, m.Keys.Quit, m.Keys.ForceQuit, m.Confirm.Back) {
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
	case m.showHelp && (global(m.Keys.Help) || key.Matches(k, m.Confirm.Back) || global(m.Keys.Quit)):
		m.showHelp = false
		return nil
	case global(m.Keys.NextScreen):
		return m.switchTo((m.active + 1) % screen.ID(len(m.screens)))
	case global(m.Keys.PrevScreen):
		return m.switchTo((m.active + screen.ID(len(m.screens)) - 1) % screen.ID(len(m.screens)))
	case global(m.Keys.Save):
		return m.askSave(false, nil)
	case global(m.Keys.Open):
		return m.askOpen()
	case global(m.Keys.Help):
		m.showHelp = !m.showHelp
		return nil
	case global(m.Keys.Quit):
		return m.quit()
	case global(m.Keys.Units):
		return m.nextUnits()
	case global(m.Keys.GoTo):
		return m.switchTo(screen.ID(k.Runes[0] - '1'))
	}
	if m.showHelp {
		return nil
	}
	return cur.Update(k)
}

func (m *Model) nextUnits() tea.Cmd {
	units := thermo.Units()
	for i, u := range units {
		if u == m.ctx.Units {
			m.ctx.Units = units[(i+1)%len(units)]
			break
		}
	}
	return tea.Batch(screen.Status("Energies now in "+m.ctx.Units.String()+"."), m.broadcast(screen.UnitsMsg{}))
}

func (m *Model) switchTo(id screen.ID) tea.Cmd {
	if id < 0 || int(id) >= len(m.screens) {
		return nil
	}
	m.active = id
	m.showHelp = false
	if m.statusErr && m.opts.Validate() == nil {
		m.status, m.statusErr = "", false // the error was about the screen left
	}
	if m.notice != "" && m.status == m.notice && m.noticeDealtWith() {
		m.status, m.notice = "", "" // the recovery notice is stale
	}
	return m.screens[id].Update(screen.ShownMsg{})
}

func (m *Model) openCmd(req screen.OpenMsg) tea.Cmd {
	db, memo := m.opts.DB, m.memo
	resolve := m.ctx.ResolvePath
	return func() tea.Msg {
		if db == nil {
			return openedMsg{err: errors.New("no data loaded")}
		}
		if req.File != "" {
			path, err := resolve(req.File)
			if err != nil {
				return openedMsg{err: err}
			}
			c, err := cycle.Open(db, path)
			if c != nil {
				c.SetMemo(memo)
				// A structure file the cycle file names is read beside it.
				if st := c.Settings.Structure; err == nil && st.CIF != "" && st.Cell == nil {
					var p string
					if p, err = resolve(filepath.Join(filepath.Dir(req.File), st.CIF)); err == nil {
						err = c.LoadStructureFile(p, st.CIF)
					}
				}
			}
			return openedMsg{c: c, path: path, err: err}
		}
		c, err := cycle.Build(db, req.Formula, cycle.Options{Memo: memo})
		return openedMsg{c: c, guided: req.Guided, err: err}
	}
}

func (m *Model) opened(msg openedMsg) tea.Cmd {
	if msg.err != nil {
		m.status, m.statusErr = strings.TrimSpace(m.kept+" "+session.Message(msg.err)), true
		m.kept = ""
		return nil
	}
	solve := m.sess.Open(msg.c, msg.path)
	m.status, m.statusErr = "", false
	if msg.path != "" {
		m.status = "Opened " + m.name(msg.path) + "."
	}
	if m.kept != "" {
		m.status = strings.TrimSpace(m.kept + " " + m.status)
		m.kept = ""
	}
	target := screen.Bench
	if msg.guided {
		target = screen.Assembly
	}
	return tea.Batch(m.broadcast(session.OpenedMsg{}), solve, m.switchTo(target))
}

// layout hands every screen its body size.
func (m *Model) layout() {
	w, h := m.bodySize()
	for _, s := range m.screens {
		s.SetSize(w, h)
	}
	m.help.Width = m.width
	m.prompt.SetWidth(min(w-6, 90))
}

func (m *Model) bodySize() (int, int) { return max(m.width, 1), max(m.height-3, 1) }

func (m *Model) tooSmall() bool {
	return m.width > 0 && m.height > 0 && (m.width < MinWidth || m.height < MinHeight)
}

// View draws the header, the body (screen, help, question or prompt), the
// status line and the help line.
func (m *Model) View() (out string) {
	defer m.recoverAndRepanic()
	if m.quitting {
		if m.recovered != "" {
			return "Unsaved work kept in " + m.name(m.recovered) + "\n"
		}
		return ""
	}
	st := m.ctx.Styles
	if m.width == 0 || m.height == 0 {
		return "starting…"
	}
	if m.tooSmall() {
		return m.smallView()
	}
	w, h := m.bodySize()
	var body string
	switch {
	case m.prompt.Active():
		body = m.centre(st.Overlay.Render(m.prompt.View()), w, h)
	case m.confirming:
		body = m.centre(st.Overlay.Render(m.confirmView()), w, h)
	case m.showHelp:
		body = m.centre(st.Overlay.Render(m.fullHelpView()), w, h)
	default:
		body = m.screens[m.active].View()
	}
	body = m.ctx.Styles.Renderer().NewStyle().Width(w).Height(h).MaxHeight(h).MaxWidth(w).Render(body)
	return lipgloss.JoinVertical(lipgloss.Left, m.header(), body, m.statusLine(), m.helpLine())
}

func (m *Model) centre(box string, w, h int) string {
	return m.ctx.Styles.Renderer().Place(w, h, lipgloss.Center, lipgloss.Center, box)
}

func (m *Model) smallView() string {
	st := m.ctx.Styles
	box := st.Renderer().NewStyle().Width(m.width).MaxHeight(m.height)
	switch {
	case m.confirming:
		lines := m.smallQuestion()
		if lines == nil {
			return box.Render(st.Warn.Render("The window is too small to show the unsaved-changes question; enlarge it, or press esc to go back to work."))
		}
		lines[0] = st.Title.Render(lines[0])
		return box.Render(strings.Join(lines, "\n"))
	case m.prompt.Active():
		return box.Render(st.Warn.Render("A file name is asked; enlarge the window to see it, or press esc to cancel."))
	}
	msg := fmt.Sprintf("The window is %d×%d; the workshop needs at least %d×%d.\nEnlarge the window, or press q to quit.",
		m.width, m.height, MinWidth, MinHeight)
	return box.Render(st.Warn.Render(msg))
}

func (m *Model) header() string {
	st := m.ctx.Styles
	right := m.ctx.Units.String()
	if c := m.sess.Cycle; c != nil {
		name := c.Formula
		if m.sess.Dirty {
			name += " (unsaved)"
		}
		right = name + " · " + right
	}
	right = st.Header.Render(right)
	// The compound, the unsaved marker and the unit always show: when the
	// tabs with their names leave no room, the tabs close up, and then the
	// screens not shown keep only their numbers (the active one its name).
	var left string
	for level := range 3 {
		left = m.tabs(level)
		if lipgloss.Width(left)+lipgloss.Width(right)+1 <= m.width {
			break
		}
	}
	gap := m.width - lipgloss.Width(left) - lipgloss.Width(right)
	if gap < 1 {
		return m.ctx.Styles.Renderer().NewStyle().MaxWidth(m.width).Render(right)
	}
	return left + strings.Repeat(" ", gap) + right
}

// tabs draws the screen tabs: at level 0 spaced with every name, at 1
// closed up, at 2 closed up with the active screen's name and the other
// screens' numbers.
func (m *Model) tabs(level int) string {
	st := m.ctx.Styles
	tab, active := st.Tab, st.ActiveTab
	if level > 0 {
		tab, active = tab.UnsetPadding(), active.UnsetPadding()
	}
	var tabs []string
	for i, s := range m.screens {
		label := fmt.Sprintf("%d %s", i+1, s.Title())
		if screen.ID(i) == m.active {
			tabs = append(tabs, active.Render("["+label+"]"))
			continue
		}
		if level == 2 {
			label = fmt.Sprint(i + 1)
		}
		tabs = append(tabs, tab.Render(" "+label+" "))
	}
	return strings.Join(tabs, "")
}

func (m *Model) statusLine() string {
	st := m.ctx.Styles
	text := m.shown(m.status)
	var out string
	switch {
	case text != "" && m.statusErr:
		out = st.Error.Render("error: ") + st.Text.Render(text)
	case text != "":
		out = st.Text.Render(text)
	case m.sess.Path != "":
		out = st.Muted.Render("file: " + m.name(m.sess.Path))
	default:
		out = st.Muted.Render("enthalpath workshop — " + m.helpKeys() + " lists every key")
	}
	return ansi.Truncate(out, m.width, "…") // a cut shows
}

func (m *Model) helpLine() string {
	line := m.help.ShortHelpView(m.ShortHelp())
	wide := m.help
	wide.Width = 0 // unbounded, to see whether it all fits
	if !m.confirming && !m.prompt.Active() {
		// Too narrow for every key: the screen's last keys give way, so
		// the help and quit keys at the end stay (q quit fell off at 80).
		b, globals := m.ShortHelp(), m.globalShortHelp()
		screenKeys := b[:len(b)-len(globals)]
		for len(screenKeys) > 1 && lipgloss.Width(wide.ShortHelpView(append(slices.Clip(screenKeys), globals...))) > m.width {
			screenKeys = screenKeys[:len(screenKeys)-1]
		}
		line = m.help.ShortHelpView(append(slices.Clip(screenKeys), globals...))
	}
	if m.confirming && lipgloss.Width(wide.ShortHelpView(m.ShortHelp())) > m.width {
		// The question's box says what follows each answer; the line
		// keeps every key with its bare name rather than lose the last.
		line = m.help.ShortHelpView(m.confirmKeys())
	}
	return m.ctx.Styles.Renderer().NewStyle().MaxWidth(m.width).Render(line)
}

// ShortHelp is the always-visible help line: the screen's main keys and
// the few global ones; while a file name is asked, the prompt's keys.
func (m *Model) ShortHelp() []key.Binding {
	if m.prompt.Active() {
		return m.prompt.ShortHelp()
	}
	if m.confirming {
		return m.confirmBindings()
	}
	b := slices.Clip(m.screens[m.active].ShortHelp())
	if len(b) == 0 && !m.screens[m.active].Capturing() {
		b = []key.Binding{m.Keys.GoTo} // a screen with nothing to act on yet
	}
	return append(b, m.globalShortHelp()...)
}

// globalShortHelp is the end of the help line: the keys that open the key
// list and quit, those that work while the screen is typing.
func (m *Model) globalShortHelp() []key.Binding {
	if m.screens[m.active].Capturing() {
		var b []key.Binding
		if h, ok := nav.WithoutPrintable(m.Keys.Help); ok {
			b = append(b, h)
		}
		return append(b, m.Keys.ForceQuit)
	}
	return []key.Binding{m.Keys.Help, m.Keys.Quit}
}

// FullHelp is the overlay's content: the screen's keys, then the global
// keys — while the screen is typing, only the global keys that still work
// (the non-printable ones).
func (m *Model) FullHelp() [][]key.Binding {
	k := m.Keys
	groups := m.screens[m.active].FullHelp()
	globals := [][]key.Binding{{k.NextScreen, k.PrevScreen, k.GoTo, k.Units}, {k.Save, k.Open, k.Help, k.Quit, k.ForceQuit}}
	if m.screens[m.active].Capturing() {
		for i, g := range globals {
			var kept []key.Binding
			for _, b := range g {
				if nb, ok := nav.WithoutPrintable(b); ok {
					kept = append(kept, nb)
				}
			}
			globals[i] = kept
		}
	}
	return append(groups, globals...)
}

// helpKeys names the keys that open the key list on the screen shown ("?
// or f1"; "f1" while the screen is typing, when ? is text).
func (m *Model) helpKeys() string {
	b := m.Keys.Help
	if m.screens[m.active].Capturing() {
		b, _ = nav.WithoutPrintable(b)
	}
	return strings.Join(b.Keys(), " or ")
}

func (m *Model) fullHelpView() string {
	st := m.ctx.Styles
	inner := max(20, m.width-6) // the box's border and padding take 4, the margin 2
	wrap := st.Muted.Width(inner)
	title := st.Title.Render("Keys on the "+m.screens[m.active].Title()+" screen, then everywhere") + st.Muted.Render(" (esc closes)")
	note := wrap.Render("While typing (Shelf, values, file names) letters are text: use tab, ctrl keys, f1, esc.")
	return title + "\n" + m.keyColumns(m.FullHelp(), inner) + "\n" + note
}

// keyColumns lays the help groups out as columns, starting a new band of
// columns below when the next would not fit in width, so every key shows.
func (m *Model) keyColumns(groups [][]key.Binding, width int) string {
	st := m.ctx.Styles
	var bands []string
	var band []string
	used := 0
	for _, g := range groups {
		kw := 0
		for _, b := range g {
			if b.Enabled() {
				kw = max(kw, lipgloss.Width(b.Help().Key))
			}
		}
		var lines []string
		for _, b := range g {
			if !b.Enabled() {
				continue
			}
			h := b.Help()
			lines = append(lines, st.HelpKey.Render(h.Key+strings.Repeat(" ", kw-lipgloss.Width(h.Key)))+" "+st.HelpDesc.Render(h.Desc))
		}
		if len(lines) == 0 {
			continue
		}
		col := strings.Join(lines, "\n")
		w := lipgloss.Width(col) + 3
		if used > 0 && used+w > width {
			bands = append(bands, lipgloss.JoinHorizontal(lipgloss.Top, band...))
			band, used = nil, 0
		}
		band = append(band, m.ctx.Styles.Renderer().NewStyle().PaddingRight(3).Render(col))
		used += w
	}
	if len(band) > 0 {
		bands = append(bands, lipgloss.JoinHorizontal(lipgloss.Top, band...))
	}
	return strings.Join(bands, "\n")
}
