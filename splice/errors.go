package splice

import "errors"

// ErrNoDetailing is returned by Size and SizeExhaustive when no configuration of the design
// space can be detailed on the section at all, whatever the forces: the flange is too narrow
// for two bolt lines of every bolt size tried, or the web too shallow for two bolt rows.
var ErrNoDetailing = errors.New("splice: no configuration of the design space can be detailed on this section (check the web depth for two bolt rows and the flange width for the bolt lines)")
