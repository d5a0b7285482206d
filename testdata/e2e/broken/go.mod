module glazebad

go 1.26
