module plumb

go 1.26
