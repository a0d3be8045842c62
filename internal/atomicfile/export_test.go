package atomicfile

// resume undoes RemoveInFlight's stop, so that tests after it can write.
func resume() {
	registry.Lock()
	registry.stopping = false
	registry.Unlock()
}
