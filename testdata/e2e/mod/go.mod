module kilnlab

go 1.26
