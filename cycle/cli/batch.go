package cli

// runBatch is replaced by the real command when its engine lands.
func runBatch(env Env, args []string) error { return errNotBuilt }
