package plant

import "testing"

// TestEveryDefaultHasSource: every key that has a default says where it
// comes from (a reference with its tag, "common practice, no source",
// "from memory", or one of SourceLeftOut, SourceDerived, SourceRule), so
// that the run's record of the defaults in force names a source for each.
func TestEveryDefaultHasSource(t *testing.T) {
	t.Parallel()
	for _, k := range Kinds() {
		for _, key := range k.Keys() {
			if (key.HasDefault || key.DefaultNote != "") && key.Source == "" {
				t.Errorf("%s.%s has a default (%s) without a Source", k.Name, key.Name, key.DefaultText())
			}
		}
	}
}
