module spillway

go 1.26
