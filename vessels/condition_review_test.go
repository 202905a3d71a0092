package vessels

import (
	"regexp"
	"testing"
)

// TestSoundingAboveTopMessage: the place of the sounding pipe in the
// message is written as a position is, to the centimetre with its unit
// (it read "x = 68.97052401746726, y = 0").
func TestSoundingAboveTopMessage(t *testing.T) {
	v, info := openBundled(t, "ferry")
	src := "format = 1\nkeep = [\"Lightship: hull steel\"]\n[[tank]]\nname = \"Fore peak tank\"\nsounding_m = 4.6\n"
	_, err := ParseCondition("c.toml", []byte(src), v, info)
	if err == nil {
		t.Fatal("a sounding above the fore peak's top was taken")
	}
	if !regexp.MustCompile(`is more than "Fore peak tank" can sound: it is full at \d+\.\d{3} m at its sounding pipe \(x = \d+\.\d\d m, y = -?\d+\.\d\d m\)`).MatchString(err.Error()) {
		t.Errorf("the message reads %v", err)
	}
}
