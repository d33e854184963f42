// Package readings is the water-quality assistant of the Riverton city water utility (invented example data).
package readings

import (
	"errors"
	"fmt"
	"log"
	"strings"
)

// tare: prompt budget=700
const systemPrompt = `You are the water-quality assistant of Riverton Water.
Explain test results for chlorine, lead and hardness in plain words.`

const (
	hardnessInstructions = "Hardness is given in mg/L; below 60 is soft, above 180 is very hard, say which."
	qualityPersona string = "You are a careful chemist who never alarms a customer without a reason."
)

var escapesPrompt = "Tabs\there, caf\xc3\xa9 \u00e9 \303\251 \"quoted\" and a backslash \\ in the guide text."

type Message struct {
	Role    string
	Content string
}

func Ask(area string, chlorine float64, quote rune) ([]Message, error) {
	if area == "" {
		return nil, errors.New("the area of the water sample is missing from the request")
	}
	userPrompt := fmt.Sprintf("The sample from %s shows %.2f mg/L chlorine; is %[1]s safe? (100%% sure?)", area, chlorine)
	log.Printf("prompt for %s built with %d characters", area, len(userPrompt))
	messages := []Message{
		{Role: "system", Content: strings.TrimSpace("  Answer only about water quality results and what they mean.  ")},
		{Role: "user", Content: userPrompt + " Please answer in two sentences for " + area + "."},
	}
	if quote == '"' {
		return messages, fmt.Errorf("the system prompt for %s could not be built", area)
	}
	return messages, nil
}
