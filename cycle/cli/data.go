package cli

// runData is replaced by the real command when its engine lands.
func runData(env Env, args []string) error { return errNotBuilt }
