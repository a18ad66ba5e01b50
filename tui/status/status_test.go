package status

import "testing"

// TestErrorsAndNotices: an error is cleared by ClearError, news is not; a
// notice shows only on an empty line and goes once stale (the package's
// contract).
func TestErrorsAndNotices(t *testing.T) {
	var l Line
	l.Fail("bad")
	l.ClearError()
	if l.Text() != "" {
		t.Errorf("error kept: %q", l.Text())
	}
	l.Say("Saved x.")
	l.ClearError()
	if l.Text() != "Saved x." {
		t.Errorf("news cleared as an error")
	}
	if l.Notice("recovery") {
		t.Error("a notice replaced news")
	}
	var n Line
	if !n.Notice("recovery") || n.Text() != "recovery" {
		t.Fatal("notice not shown on an empty line")
	}
	n.DropNotice(func() bool { return false })
	if n.Text() != "recovery" {
		t.Error("a notice still valid was dropped")
	}
	n.DropNotice(func() bool { return true })
	if n.Text() != "" {
		t.Error("a stale notice stayed")
	}
}
