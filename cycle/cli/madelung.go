package cli

// runMadelung is replaced by the real command when its engine lands.
func runMadelung(env Env, args []string) error { return errNotBuilt }
