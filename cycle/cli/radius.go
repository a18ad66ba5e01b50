package cli

// runRadius is replaced by the real command when its engine lands.
func runRadius(env Env, args []string) error { return errNotBuilt }
