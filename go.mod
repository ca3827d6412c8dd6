module plumb

go 1.26.0

require (
	github.com/chromedp/cdproto v0.159.0 // indirect
	github.com/chromedp/chromedp v0.23.0 // indirect
	github.com/go-json-experiment/json v0.0.0-20260213210345-44df1a37e875 // indirect
	github.com/go-pdf/fpdf v0.9.0 // indirect
	github.com/paulmach/orb v0.14.0 // indirect
	golang.org/x/image v0.48.0 // indirect
	gonum.org/v1/gonum v0.17.0 // indirect
)
