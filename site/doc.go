// Package site places assessed samples on a site and draws what a report shows of
// them: SI maps per mineral, depth zone and sampling round (interpolated
// surfaces, with their leave-one-out cross-validation error), depth profiles per
// well cluster and a Piper diagram. Build composes them; the figures are plain
// values of package figure, rendered by the caller.
package site
