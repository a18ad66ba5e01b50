package cli

// runEstimate is replaced by the real command when its engine lands.
func runEstimate(env Env, args []string) error { return errNotBuilt }
