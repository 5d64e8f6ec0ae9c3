"""The decision strategies: each turns the estimates into an order of integration."""
