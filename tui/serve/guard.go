package serve

import (
	"fmt"
	"reflect"
	"runtime/debug"
	"sync"
	"time"

	tea "github.com/charmbracelet/bubbletea"
)

// saveBudget bounds how long a failed model may take to write its recovery
// file.
const saveBudget = 2 * time.Second

// cmdPanicked reports a panic inside a command back to the event loop.
type cmdPanicked struct{}

// guard wraps a session's root model so that a panic in its Init, Update,
// View or in any command it returns stays inside the session: the panic is
// reported, the model is asked once to save its work, and the program
// quits. Bubble Tea's own panic catching remains as a last resort.
type guard struct {
	inner    tea.Model
	shutdown func(reason string) tea.Msg
	report   func(where string, value any, stack []byte)
	send     func(tea.Msg) // sends to the program from outside the event loop

	mu        sync.Mutex
	failed    bool
	saved     bool
	saveEnded chan struct{} // closed when the save after a failure is over
}

// Recoverer is a session model that says where it kept unsaved work: the
// file it wrote when told to shut down or after a failure, or "". The
// server asks it when the session ends, to tell the member, rather than
// guess from the folder.
type Recoverer interface{ RecoveredTo() string }

// recoveredTo asks the model where it kept unsaved work, once the program
// has stopped; "" when it kept none, cannot say, or is still saving after a
// failure past saveBudget.
func (g *guard) recoveredTo() string {
	g.mu.Lock()
	ended := g.saveEnded
	g.mu.Unlock()
	if ended != nil {
		select {
		case <-ended:
		case <-time.After(saveBudget):
			return ""
		}
	}
	r, ok := g.inner.(Recoverer)
	if !ok {
		return ""
	}
	return r.RecoveredTo()
}

var _ tea.Model = (*guard)(nil)

func newGuard(inner tea.Model, shutdown func(string) tea.Msg, report func(string, any, []byte)) *guard {
	return &guard{inner: inner, shutdown: shutdown, report: report}
}

// Failed reports whether the model panicked.
func (g *guard) Failed() bool {
	g.mu.Lock()
	defer g.mu.Unlock()
	return g.failed
}

func (g *guard) fail(where string, value any) {
	g.mu.Lock()
	first := !g.failed
	g.failed = true
	g.mu.Unlock()
	if first {
		g.report(where, value, debug.Stack())
	}
}

// Init implements tea.Model.
func (g *guard) Init() (cmd tea.Cmd) {
	defer func() {
		if r := recover(); r != nil {
			g.fail("Init", r)
			cmd = tea.Quit
		}
	}()
	return g.wrap(g.inner.Init())
}

// Update implements tea.Model.
func (g *guard) Update(msg tea.Msg) (model tea.Model, cmd tea.Cmd) {
	if _, ok := msg.(cmdPanicked); ok {
		g.save()
		return g, tea.Quit
	}
	if g.Failed() {
		if _, ok := msg.(tea.QuitMsg); ok {
			return g, nil
		}
		return g, tea.Quit
	}
	defer func() {
		if r := recover(); r != nil {
			g.fail(fmt.Sprintf("Update(%T)", msg), r)
			g.save()
			model, cmd = g, tea.Quit
		}
	}()
	inner, cmd := g.inner.Update(msg)
	g.inner = inner
	return g, g.wrap(cmd)
}

// View implements tea.Model.
func (g *guard) View() (view string) {
	if g.Failed() {
		return "enthalpath: this session hit an internal error and is closing.\n"
	}
	defer func() {
		if r := recover(); r != nil {
			g.fail("View", r)
			if g.send != nil {
				// The event loop is busy drawing this frame: have the next
				// Update save and quit.
				go g.send(cmdPanicked{})
			}
			view = "enthalpath: this session hit an internal error and is closing.\n"
		}
	}()
	return g.inner.View()
}

// save asks the failed model, once, to write its recovery file: it gets the
// shutdown message, and the command it returns is run here, within
// saveBudget, panics and all contained.
func (g *guard) save() {
	g.mu.Lock()
	if g.saved {
		g.mu.Unlock()
		return
	}
	g.saved = true
	done := make(chan struct{})
	g.saveEnded = done
	g.mu.Unlock()
	go func() {
		defer close(done)
		defer func() {
			if r := recover(); r != nil {
				g.report("saving after a failure", r, nil)
			}
		}()
		_, cmd := g.inner.Update(g.shutdown("internal error"))
		runCmd(cmd, 3)
	}()
	select {
	case <-done:
	case <-time.After(saveBudget):
		g.report("saving after a failure", "took longer than "+saveBudget.String(), nil)
	}
}

// runCmd runs cmd and, up to depth levels, the commands inside a batch or
// sequence it returns, discarding their messages.
func runCmd(cmd tea.Cmd, depth int) {
	if cmd == nil || depth == 0 {
		return
	}
	msg := cmd()
	if inner, ok := cmdList(msg); ok {
		for _, c := range inner {
			runCmd(c, depth-1)
		}
	}
}

var cmdType = reflect.TypeOf((tea.Cmd)(nil))

// cmdList returns the commands of a batch or sequence message. Bubble Tea's
// sequence type is unexported, so both are recognised by shape: a slice of
// tea.Cmd.
func cmdList(msg tea.Msg) ([]tea.Cmd, bool) {
	if msg == nil {
		return nil, false
	}
	v := reflect.ValueOf(msg)
	if v.Kind() != reflect.Slice || v.Type().Elem() != cmdType {
		return nil, false
	}
	out := make([]tea.Cmd, v.Len())
	for i := range out {
		out[i], _ = v.Index(i).Interface().(tea.Cmd)
	}
	return out, true
}

// wrap makes cmd report a panic as cmdPanicked instead of crashing the
// server, and wraps the commands of any batch or sequence it returns, so
// the program runs only guarded commands.
func (g *guard) wrap(cmd tea.Cmd) tea.Cmd {
	if cmd == nil {
		return nil
	}
	return func() (msg tea.Msg) {
		defer func() {
			if r := recover(); r != nil {
				g.fail("command", r)
				msg = cmdPanicked{}
			}
		}()
		return g.wrapList(cmd())
	}
}

// wrapList rebuilds a batch or sequence message (keeping its type, which
// tells Bubble Tea whether to run the commands together or in order) with
// every command guarded; any other message is returned as is.
func (g *guard) wrapList(msg tea.Msg) tea.Msg {
	if msg == nil {
		return nil
	}
	v := reflect.ValueOf(msg)
	if v.Kind() != reflect.Slice || v.Type().Elem() != cmdType {
		return msg
	}
	out := reflect.MakeSlice(v.Type(), v.Len(), v.Len())
	for i := 0; i < v.Len(); i++ {
		c, _ := v.Index(i).Interface().(tea.Cmd)
		out.Index(i).Set(reflect.ValueOf(g.wrap(c)))
	}
	return out.Interface()
}
