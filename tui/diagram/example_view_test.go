package diagram

import (
	"fmt"
	"os"
	"testing"
)

func TestShowScratch(t *testing.T) {
	if os.Getenv("SHOW") == "" {
		t.Skip()
	}
	d := sampleNaCl()
	fmt.Println(d.Render(80, 18, Styles{}))
	fmt.Println(d.Render(120, 26, Styles{}))
}
