export { choiceWords } from './choiceWords';
